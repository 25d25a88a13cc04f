/**
 * The families of audit actions an auditor filters by ("kind"). Actions are named
 * `<thing>.<verb>` (`transmitter.update`, `auth.sign-in`, `export.audit-events`); a kind is the set
 * of action prefixes it covers, plus any single actions that belong elsewhere than their prefix
 * says (downloading an import's original is an export). This is the one place that maps an action
 * to its kind: the server filters with it and the screen labels with it.
 */
export const AUDIT_KINDS = [
  'configuration',
  'sign-in',
  'import',
  'export',
  'correction',
  'alarm',
  'user',
  'device',
  'period',
  'other',
] as const;
export type AuditKind = (typeof AUDIT_KINDS)[number];

interface KindRule {
  /** Actions starting with one of these belong to the kind (unless claimed by another kind's `actions`). */
  prefixes: readonly string[];
  /** Single actions that belong to the kind whatever their prefix. */
  actions?: readonly string[];
}

/** Set-up that shapes a result (sites, meter runs, configuration and settings versions, transmitters, calibrations) is "configuration". */
export const AUDIT_KIND_RULES: Record<Exclude<AuditKind, 'other'>, KindRule> = {
  configuration: {
    prefixes: [
      'site.',
      'meter-run.',
      'config-version.',
      'settings-version.',
      'transmitter.',
      'calibration.',
      'site-settings.',
      'meter-run-settings.',
      'transmitter-settings.',
    ],
  },
  'sign-in': { prefixes: ['auth.'] },
  import: { prefixes: ['import.'] },
  export: { prefixes: ['export.'], actions: ['import.download-original'] },
  // A re-sent reading's conflict is resolved by a correction.
  correction: { prefixes: ['correction.', 'reading-conflict.'] },
  alarm: { prefixes: ['alarm-limits.', 'alarm.'] },
  user: { prefixes: ['user.'] },
  device: { prefixes: ['device.'] },
  period: { prefixes: ['period.'] },
};

/** Words for each kind, for a filter or a row label. */
export const AUDIT_KIND_LABELS: Record<AuditKind, string> = {
  configuration: 'Configuration',
  'sign-in': 'Sign-in',
  import: 'Import',
  export: 'Export',
  correction: 'Correction',
  alarm: 'Alarm limits',
  user: 'User',
  device: 'Device',
  period: 'Period close',
  other: 'Other',
};

const ruleEntries = Object.entries(AUDIT_KIND_RULES) as [Exclude<AuditKind, 'other'>, KindRule][];
const claimedActions = ruleEntries.flatMap(([, rule]) => rule.actions ?? []);

/** @returns the kind of an action, e.g. `auditKindOf('transmitter.update')` is `'configuration'` */
export function auditKindOf(action: string): AuditKind {
  for (const [kind, rule] of ruleEntries) if (rule.actions?.includes(action)) return kind;
  for (const [kind, rule] of ruleEntries) if (rule.prefixes.some((p) => action.startsWith(p))) return kind;
  return 'other';
}

/**
 * What a database needs to select one kind's actions: its single actions, its prefixes, and the
 * actions it must leave out because another kind claims them. For `other`, `prefixes` and
 * `actions` list everything that belongs to some kind, and `negate` says to take what is left.
 */
export function auditKindMatch(kind: AuditKind): {
  actions: string[];
  prefixes: string[];
  excluded: string[];
  negate: boolean;
} {
  if (kind === 'other') {
    return {
      actions: claimedActions,
      prefixes: ruleEntries.flatMap(([, rule]) => rule.prefixes),
      excluded: [],
      negate: true,
    };
  }
  const rule = AUDIT_KIND_RULES[kind];
  const own = rule.actions ?? [];
  return {
    actions: [...own],
    prefixes: [...rule.prefixes],
    excluded: claimedActions.filter((a) => !own.includes(a)),
    negate: false,
  };
}
