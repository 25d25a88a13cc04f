import { testApp } from '../../test-support/app';
import { alarmFixture } from '../../alarms/alarm-test-fixture';

/**
 * Four eyes on the server (issue 9 §6): who may propose, approve and reject a correction, for every
 * combination of proposer and decider; a decided correction stays decided; bad input is named.
 */
let t: Awaited<ReturnType<typeof testApp>>;
type User = Awaited<ReturnType<typeof t.signedIn>>;
let people: Record<'engineer' | 'engineer2' | 'admin' | 'admin2' | 'operator' | 'accountant', User>;
let f: Awaited<ReturnType<typeof alarmFixture>>;
let other: Awaited<ReturnType<typeof alarmFixture>>;

beforeAll(async () => {
  t = await testApp();
  people = {
    engineer: await t.signedIn('engineer'),
    engineer2: await t.signedIn('engineer'),
    admin: await t.signedIn('admin'),
    admin2: await t.signedIn('admin'),
    operator: await t.signedIn('operator'),
    accountant: await t.signedIn('accountant'),
  };
  f = await alarmFixture(t, people.engineer.token);
  other = await alarmFixture(t, people.engineer.token);
});
afterAll(() => t.close());

const adjustment = (overrides: Record<string, unknown> = {}) => ({
  meterRunId: f.meterRunId,
  start: '2026-10-10T00:00:00Z',
  end: '2026-10-11T00:00:00Z',
  kind: 'adjust',
  factor: 1.02,
  reason: 'orifice plate found worn; 2 % under-registration by inspection',
  ...overrides,
});

const propose = (who: User, body: Record<string, unknown>) =>
  t.http().post('/api/corrections').set('Authorization', `Bearer ${who.token}`).send(body);
const decide = (
  who: User,
  id: string,
  decision: 'approve' | 'reject',
  reason = 'checked against the inspection report',
) => t.http().post(`/api/corrections/${id}/${decision}`).set('Authorization', `Bearer ${who.token}`).send({ reason });

describe('proposing a correction', () => {
  it('answers 201 with the id and status proposed, and audits it with the reason', async () => {
    const res = await propose(people.engineer, adjustment());
    expect(res.status).toBe(201);
    expect(Object.keys(res.body).slice(0, 2)).toEqual(['id', 'status']);
    expect(res.body).toMatchObject({ status: 'proposed', kind: 'adjust', factor: 1.02, origin: 'manual' });
    const audit = await t
      .http()
      .get(`/api/audit-events?entityType=correction&entityId=${res.body.id}`)
      .set('Authorization', `Bearer ${people.admin.token}`);
    expect(audit.status).toBe(200);
    const event = (audit.body.events ?? audit.body).find((e: { action: string }) => e.action === 'correction.propose');
    expect(event).toMatchObject({ reason: adjustment().reason });
  });

  it.each(['operator', 'accountant'] as const)('is refused to the %s role (403)', async (role) => {
    const res = await propose(people[role], adjustment());
    expect(res.status).toBe(403);
  });

  it.each([
    ['end before start', { end: '2026-10-09T00:00:00Z' }, 'end'],
    ['a factor of 0', { factor: 0 }, 'factor'],
    ['a negative factor', { factor: -1 }, 'factor'],
    ['no reason', { reason: undefined }, 'reason'],
    ['an empty reason', { reason: '   ' }, 'reason'],
    ['an adjustment without a factor', { factor: undefined }, 'factor'],
    ['a start inside an hour', { start: '2026-10-10T00:30:00Z' }, 'start'],
    ['a local time without a zone', { start: '2026-10-10T00:00:00' }, 'start'],
    ['a period in the future', { end: '2099-01-01T00:00:00Z' }, 'end'],
    ['an unknown kind', { kind: 'replace' }, 'kind'],
    ['no meter run', { meterRunId: undefined }, 'meterRunId'],
    ['a meter run that does not exist', { meterRunId: '999999999' }, 'meterRunId'],
  ])('refuses %s with a 400 naming the field', async (_what, overrides, field) => {
    const res = await propose(people.engineer, adjustment(overrides));
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
  });

  it.each([
    ['neither a quantity nor readings', {}, 'massKg'],
    ['both a quantity and readings', { massKg: 5, substitute: { transmitterId: '1', value: 3 } }, 'massKg'],
    ['a negative quantity', { massKg: -5 }, 'massKg'],
    ['a factor', { massKg: 5, factor: 2 }, 'factor'],
    ['a substitute value that is not a number', { substitute: { transmitterId: '1', value: 'x' } }, 'substitute'],
  ])('refuses a substitution with %s, naming the field', async (_what, overrides, field) => {
    const res = await propose(people.engineer, adjustment({ kind: 'substitute', factor: undefined, ...overrides }));
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe(field);
  });

  it('refuses substituted readings of another meter run’s transmitter, naming substitute.transmitterId', async () => {
    const res = await propose(
      people.engineer,
      adjustment({ kind: 'substitute', factor: undefined, substitute: { transmitterId: other.dp.id, value: 20 } }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('substitute.transmitterId');
  });

  it('refuses to hold a value when the transmitter has no reading before the period, naming substitute.hold', async () => {
    const res = await propose(
      people.engineer,
      adjustment({ kind: 'substitute', factor: undefined, substitute: { transmitterId: f.dp.id, hold: true } }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('substitute.hold');
  });

  it('refuses a quantity substitution on a bi-directional meter run, naming massKg, and takes a factor there', async () => {
    const bi = await alarmFixture(t, people.engineer.token);
    const orifice = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 };
    const version = await t
      .http()
      .post(`/api/meter-runs/${bi.meterRunId}/config-versions`)
      .set('Authorization', `Bearer ${people.engineer.token}`)
      .send({
        effectiveFrom: '2026-10-10T12:00:00Z',
        element: orifice,
        fluid: {
          kind: 'ideal-gas',
          molarMassKgPerMol: 0.01804,
          compressibility: 1,
          isentropicExponent: 1.2,
          viscosityPaS: 1.12e-5,
        },
        reverseElement: orifice,
        reason: 'bi-directional from noon',
      });
    expect(version.status).toBe(201);
    const quantity = { meterRunId: bi.meterRunId, kind: 'substitute', factor: undefined, massKg: 1000 };
    // The day overlaps the bi-directional version from noon on.
    const refused = await propose(people.engineer, adjustment(quantity));
    expect(refused.status).toBe(400);
    expect(refused.body.error.field).toBe('massKg');
    expect(refused.body.error.message).toMatch(/bi-directional/);
    // The morning before it is one-way: a quantity is accepted there.
    const morning = await propose(people.engineer, adjustment({ ...quantity, end: '2026-10-10T12:00:00Z' }));
    expect(morning.status).toBe(201);
    expect((await propose(people.engineer, adjustment({ meterRunId: bi.meterRunId }))).status).toBe(201);
  });
});

describe('four eyes: every proposer against every decider', () => {
  type Who = keyof typeof people;
  const combinations: [Who, Who, number][] = [
    ['engineer', 'engineer', 403],
    ['engineer', 'engineer2', 200],
    ['engineer', 'admin', 200],
    ['engineer', 'operator', 403],
    ['engineer', 'accountant', 403],
    ['admin', 'admin', 403],
    ['admin', 'admin2', 200],
    ['admin', 'engineer', 200],
    ['admin', 'engineer2', 200],
    ['admin', 'operator', 403],
    ['admin', 'accountant', 403],
  ];
  for (const decision of ['approve', 'reject'] as const) {
    it.each(combinations)(
      `a correction by %s, ${decision === 'approve' ? 'approved' : 'rejected'} by %s, answers %d`,
      async (proposer, decider, status) => {
        const created = await propose(people[proposer], adjustment());
        expect(created.status).toBe(201);
        const res = await decide(people[decider], created.body.id, decision);
        expect(res.status).toBe(status);
        if (status === 403 && proposer === decider) expect(res.body.error.code).toBe('own_correction');
        if (status === 200) {
          expect(res.body).toMatchObject({
            id: created.body.id,
            status: decision === 'approve' ? 'approved' : 'rejected',
            decidedBy: { id: people[decider].id },
            decisionReason: 'checked against the inspection report',
          });
        } else {
          const after = await t
            .http()
            .get(`/api/corrections/${created.body.id}`)
            .set('Authorization', `Bearer ${people.operator.token}`);
          expect(after.body.status).toBe('proposed');
        }
      },
    );
  }
});

describe('a decided correction', () => {
  it('cannot be approved or rejected again (409), and the first decision stands', async () => {
    const created = await propose(people.engineer, adjustment());
    expect((await decide(people.engineer2, created.body.id, 'reject')).status).toBe(200);
    const again = await decide(people.admin, created.body.id, 'approve');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('decided');
    expect((await decide(people.engineer2, created.body.id, 'reject')).status).toBe(409);
    const list = await t
      .http()
      .get(`/api/corrections?meterRunId=${f.meterRunId}&status=rejected`)
      .set('Authorization', `Bearer ${people.accountant.token}`);
    expect(list.status).toBe(200);
    const found = list.body.find((c: { id: string }) => c.id === created.body.id);
    expect(found).toMatchObject({ status: 'rejected', decidedBy: { id: people.engineer2.id } });
    expect(list.body.every((c: { status: string }) => c.status === 'rejected')).toBe(true);
  });

  it('is audited with the reason and the old and new values', async () => {
    const created = await propose(people.engineer, adjustment());
    await decide(people.admin, created.body.id, 'approve', 'inspection report attached to the work order');
    const audit = await t
      .http()
      .get(`/api/audit-events?entityType=correction&entityId=${created.body.id}`)
      .set('Authorization', `Bearer ${people.admin.token}`);
    const events = audit.body.events ?? audit.body;
    const approval = events.find((e: { action: string }) => e.action === 'correction.approve');
    expect(approval).toMatchObject({
      reason: 'inspection report attached to the work order',
      before: { status: 'proposed' },
      after: { status: 'approved' },
    });
  });

  it('refuses a decision without a reason, naming reason', async () => {
    const created = await propose(people.engineer, adjustment());
    const res = await t
      .http()
      .post(`/api/corrections/${created.body.id}/approve`)
      .set('Authorization', `Bearer ${people.engineer2.token}`)
      .send({});
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('reason');
  });

  it('answers 404 for a correction that does not exist', async () => {
    expect((await decide(people.engineer2, '999999999', 'approve')).status).toBe(404);
  });
});

describe('the corrections table', () => {
  it('refuses a change of the figures, a second decision, a delete, and a decision by the proposer, whatever connects', async () => {
    const created = await propose(people.engineer, adjustment());
    const id = created.body.id as string;
    const q = (sql: string) => t.sequelize.query(sql, { replacements: { id } });
    await expect(q('UPDATE corrections SET factor = 5 WHERE id = :id')).rejects.toThrow(/only the decision may change/);
    await expect(q('DELETE FROM corrections WHERE id = :id')).rejects.toThrow(/never deleted/);
    await expect(
      q(
        `UPDATE corrections SET status = 'approved', decided_by = proposed_by, decided_at = now(), decision_reason = 'x' WHERE id = :id`,
      ),
    ).rejects.toThrow(/check constraint/);
    await decide(people.engineer2, id, 'approve');
    await expect(q(`UPDATE corrections SET status = 'rejected' WHERE id = :id`)).rejects.toThrow(/already approved/);
  });
});
