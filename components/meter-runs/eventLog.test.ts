import type { AuditEvent } from '@/hooks/api/auditEvents';
import type { ConfigVersion } from '@/hooks/api/meterRuns';
import { buildEventLog, valueInWords } from './eventLog';

const element = {
  kind: 'orifice',
  taps: 'flange',
  pipeDiameterM: 0.1023,
  boreDiameterM: 0.05,
} as ConfigVersion['element'];
const fluid = { kind: 'steam' } as ConfigVersion['fluid'];

const version = (over: Partial<ConfigVersion>): ConfigVersion => ({
  id: '1',
  meterRunId: '7',
  effectiveFrom: '2024-01-01T00:00:00.000Z',
  element,
  fluid,
  reason: 'first configuration',
  createdAt: '2024-01-01T08:00:00.000Z',
  createdBy: { email: 'eng@site.test', name: 'Eng' },
  changes: [],
  first: true,
  ...over,
});

const event = (over: Partial<AuditEvent>): AuditEvent => ({
  id: '50',
  occurredAt: '2024-03-01T10:00:00.000Z',
  actorEmail: 'eng@site.test',
  action: 'transmitter.update',
  entityType: 'transmitter',
  entityId: '12',
  before: { id: '12', tag: 'FT-1', upperRange: 25 },
  after: { id: '12', tag: 'FT-1', upperRange: 50 },
  reason: null,
  actorId: '3',
  kind: 'configuration',
  ...over,
});

describe('buildEventLog', () => {
  it('lists versions and audited changes newest recorded first, a back-dated version with its earlier effective time', () => {
    const log = buildEventLog(
      [
        version({}),
        version({
          id: '2',
          first: false,
          effectiveFrom: '2024-02-01T00:00:00.000Z',
          createdAt: '2024-04-01T09:00:00.000Z',
          reason: 'plate swapped',
          changes: [{ path: 'element.boreDiameterM', before: 0.05, after: 0.051 }],
        }),
      ],
      [event({})],
    );
    expect(log.map((e) => [e.what, e.effectiveAt])).toEqual([
      ['Configuration version', '2024-02-01T00:00:00.000Z'],
      ['transmitter.update on transmitter 12', '2024-03-01T10:00:00.000Z'],
      ['First configuration', '2024-01-01T00:00:00.000Z'],
    ]);
    expect(log[0]).toMatchObject({
      recordedAt: '2024-04-01T09:00:00.000Z',
      who: 'eng@site.test',
      reason: 'plate swapped',
      changes: [{ path: 'element.boreDiameterM', before: 0.05, after: 0.051 }],
    });
  });

  it('gives an audited change field by field, old and new, without the record id', () => {
    const [entry] = buildEventLog([], [event({})]);
    expect(entry.changes).toEqual([{ path: 'upperRange', before: 25, after: 50 }]);
    expect(entry.kindLabel).toBe('Configuration');
  });

  it('shows a configuration version once (from the history), not again from its audit event; no sign-ins or exports', () => {
    const log = buildEventLog(
      [version({})],
      [
        event({ id: '51', action: 'config-version.create', entityType: 'meter-run', entityId: '7' }),
        event({ id: '52', action: 'export.audit-events', kind: 'export', entityType: 'export', entityId: null }),
      ],
    );
    expect(log.map((e) => e.key)).toEqual(['config-version-1']);
  });

  it('lists a first configuration with every field as new', () => {
    const [entry] = buildEventLog([version({})], []);
    expect(entry.changes).toContainEqual({ path: 'element.boreDiameterM', before: null, after: 0.05 });
    expect(entry.changes).toContainEqual({ path: 'fluid.kind', before: null, after: 'steam' });
  });
});

describe('valueInWords', () => {
  it('shows text as is, other values as JSON, and a missing side as a dash', () => {
    expect(valueInWords('steam')).toBe('steam');
    expect(valueInWords(0.051)).toBe('0.051');
    expect(valueInWords(null)).toBe('—');
    expect(valueInWords({ a: 1 })).toBe('{"a":1}');
  });
});
