import { AUDIT_KINDS, auditKindMatch, auditKindOf } from './audit-kinds';

describe('auditKindOf', () => {
  it('files each action the server writes today under its family', () => {
    expect(auditKindOf('site.create')).toBe('configuration');
    expect(auditKindOf('meter-run.update')).toBe('configuration');
    expect(auditKindOf('config-version.create')).toBe('configuration');
    expect(auditKindOf('transmitter.update')).toBe('configuration');
    expect(auditKindOf('auth.sign-in')).toBe('sign-in');
    expect(auditKindOf('auth.sign-in-refused')).toBe('sign-in');
    expect(auditKindOf('import.create')).toBe('import');
    expect(auditKindOf('alarm-limits.delete')).toBe('alarm');
    expect(auditKindOf('user.update-with-password')).toBe('user');
    expect(auditKindOf('device.create')).toBe('device');
    expect(auditKindOf('export.audit-events')).toBe('export');
  });

  it('files downloading an import original as an export, not an import', () => {
    expect(auditKindOf('import.download-original')).toBe('export');
  });

  it('files an action of no known family as other', () => {
    expect(auditKindOf('something.new')).toBe('other');
  });
});

describe('auditKindMatch', () => {
  /** The same decision as a database makes from the match: a cross-check of the two ways. */
  const matches = (kind: (typeof AUDIT_KINDS)[number], action: string) => {
    const m = auditKindMatch(kind);
    const inKind =
      m.actions.includes(action) || (m.prefixes.some((p) => action.startsWith(p)) && !m.excluded.includes(action));
    return m.negate ? !inKind : inKind;
  };

  it('selects exactly the actions auditKindOf files under the kind', () => {
    const actions = [
      'site.create',
      'transmitter.update',
      'auth.sign-in',
      'import.create',
      'import.download-original',
      'export.audit-events',
      'correction.approve',
      'alarm-limits.update',
      'user.create',
      'device.update',
      'period.close',
      'something.new',
    ];
    for (const kind of AUDIT_KINDS) {
      for (const action of actions)
        expect([kind, action, matches(kind, action)]).toEqual([kind, action, auditKindOf(action) === kind]);
    }
  });
});
