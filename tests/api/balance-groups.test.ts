import { testApp } from '../../server/test-support/app';
import { judgeBalanceAlarms } from '../../server/alarms/balance-alarm';

/**
 * Balance groups (issue 10 §3, §4) on daily and monthly totals written as the history worker
 * writes them, so the numbers are known by hand. A site on UTC with contract hour 0: contract days
 * are UTC days. Wells A, B, C feed the sales meter S; allowance 1 % of the inlet, tolerance 0.5 %.
 *
 * Balance day 2026-09-10: A 100 000 m³ (U = 1.0 %), B 50 000 m³ (U = 2.0 %), C 0 m³, S 147 000 m³ (U = 0.5 %).
 *   inlet 150 000; allowance 0.01 × 150 000 = 1 500; imbalance 150 000 − 147 000 − 1 500 = 1 500 m³ = 1.0 %
 *   → outside 0.5 %. Uncertainty (JCGM 100:2008 GUM §5.1.2 eq. 10, uncorrelated members; an inlet's
 *   sensitivity is 1 − 0.01 = 0.99 because the allowance moves with it, the outlet's −1):
 *   U² = (0.99 × 1 000)² + (0.99 × 1 000)² + 735² = 2 500 425 → U = 1 581.27 m³ > 1 500: not beyond its uncertainty.
 * Day 2026-09-11: S 148 400 → imbalance 150 000 − 148 400 − 1 500 = 100 m³ = 0.0667 % → within.
 *
 * Month 2026-09: A 60 000 m³ (2.40 TJ, 1 %), B 30 000 m³ (1.26 TJ, 2 %), C 10 000 m³ (0.34 TJ, 3 %),
 * S 98 000 m³ (3.92 TJ, 0.5 %).
 *   Balance: inlet 100 000; allowance 1 000; imbalance 1 000 m³ = 1.0 %;
 *   U² = 594² + 594² + 297² + 490² = 1 033 981 → U = 1 016.85 m³.
 *   Pro-rata: factors 60 000/100 000 = 0.6, 0.3, 0.1 → 58 800, 29 400, 9 800 m³ (Σ 98 000);
 *   energy factors 2.40/4.00 = 0.6, 0.315, 0.085 → 2.352, 1.2348, 0.3332 TJ (Σ 3.92 TJ).
 */
let t: Awaited<ReturnType<typeof testApp>>;
let engineer: Awaited<ReturnType<typeof t.signedIn>>;
let accountant: Awaited<ReturnType<typeof t.signedIn>>;
const runs: Record<'A' | 'B' | 'C' | 'S' | 'other', string> = { A: '', B: '', C: '', S: '', other: '' };
let siteId = '';
let groupId = '';

const post = (body: Record<string, unknown>) =>
  t.http().post('/api/balance-groups').set('Authorization', `Bearer ${engineer.token}`).send(body);
const get = (path: string) => t.http().get(path).set('Authorization', `Bearer ${accountant.token}`);

async function makeSite() {
  const code = t.unique().toUpperCase();
  const res = await t
    .http()
    .post('/api/sites')
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({
      code: `B${code}`,
      name: `Balance test site ${code}`,
      timeZone: 'UTC',
      contractHour: 0,
      basePressurePa: 101325,
      baseTemperatureK: 288.15,
      atmosphericPressurePa: 101325,
    });
  if (res.status !== 201) throw new Error(`site: ${JSON.stringify(res.body)}`);
  return res.body.id as string;
}

async function makeRun(site: string, tag: string) {
  const res = await t
    .http()
    .post('/api/meter-runs')
    .set('Authorization', `Bearer ${engineer.token}`)
    .send({
      siteId: site,
      tag: `${tag}-${t.unique()}`,
      name: `Balance test ${tag}`,
      element: { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 },
      fluid: {
        kind: 'ideal-gas',
        molarMassKgPerMol: 0.01804,
        compressibility: 1,
        isentropicExponent: 1.2,
        viscosityPaS: 1.12e-5,
      },
      holdLimitS: 3600,
      maxGapS: 300,
      effectiveFrom: '2020-01-01T00:00:00Z',
    });
  if (res.status !== 201) throw new Error(`meter run: ${JSON.stringify(res.body)}`);
  return res.body.id as string;
}

/** A total as the history worker stores it (only the figures the balance reads matter here). */
async function writeTotal(
  table: 'daily_totals' | 'monthly_totals',
  meterRunId: string,
  period: string,
  startIso: string,
  endIso: string,
  standardVolumeM3: number,
  uncertaintyPercent: number | null,
  energyJ: number | null = null,
) {
  const periodColumn = table === 'daily_totals' ? 'contract_day' : 'month';
  await t.sequelize.query(
    `INSERT INTO ${table} (meter_run_id, ${periodColumn}, start, "end", hours, flow_time_s, mass_kg, volume_m3,
                           standard_volume_m3, energy_j, coverage, flags, uncertainty_percent, status)
     VALUES (:meterRunId, :period, :start, :end, 24, 86400, :mass, :volume, :standardVolumeM3, :energyJ, 1, '{}',
             :uncertaintyPercent, 'complete')`,
    {
      replacements: {
        meterRunId,
        period,
        start: startIso,
        end: endIso,
        mass: standardVolumeM3 * 0.75,
        volume: standardVolumeM3 / 50,
        standardVolumeM3,
        energyJ,
        uncertaintyPercent,
      },
    },
  );
}

beforeAll(async () => {
  t = await testApp();
  engineer = await t.signedIn('engineer');
  accountant = await t.signedIn('accountant');
  siteId = await makeSite();
  for (const tag of ['A', 'B', 'C', 'S'] as const) runs[tag] = await makeRun(siteId, tag);
  runs.other = await makeRun(await makeSite(), 'X');

  const day = (d: string, next: string) => [d, `${d}T00:00:00Z`, `${next}T00:00:00Z`] as const;
  for (const [dayIso, start, end] of [day('2026-09-10', '2026-09-11'), day('2026-09-11', '2026-09-12')]) {
    await writeTotal('daily_totals', runs.A, dayIso, start, end, 100_000, 1);
    await writeTotal('daily_totals', runs.B, dayIso, start, end, 50_000, 2);
    await writeTotal('daily_totals', runs.C, dayIso, start, end, 0, null);
    await writeTotal('daily_totals', runs.S, dayIso, start, end, dayIso === '2026-09-10' ? 147_000 : 148_400, 0.5);
  }
  const month = ['2026-09-01', '2026-09-01T00:00:00Z', '2026-10-01T00:00:00Z'] as const;
  await writeTotal('monthly_totals', runs.A, ...month, 60_000, 1, 2.4e12);
  await writeTotal('monthly_totals', runs.B, ...month, 30_000, 2, 1.26e12);
  await writeTotal('monthly_totals', runs.C, ...month, 10_000, 3, 0.34e12);
  await writeTotal('monthly_totals', runs.S, ...month, 98_000, 0.5, 3.92e12);
});
afterAll(() => t.close());

describe('POST /api/balance-groups', () => {
  it('creates a group of one site with its members, and audits the definition', async () => {
    const res = await post({
      siteId,
      name: 'Gathering station',
      inletMeterRunIds: [runs.A, runs.B, runs.C],
      outletMeterRunIds: [runs.S],
      allowancePercent: 1,
      tolerancePercent: 0.5,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      siteId,
      name: 'Gathering station',
      inletMeterRunIds: [runs.A, runs.B, runs.C],
      outletMeterRunIds: [runs.S],
      allowancePercent: 1,
      allowanceDailyM3: null,
      tolerancePercent: 0.5,
    });
    groupId = res.body.id;
    const [events] = await t.sequelize.query(
      `SELECT action, after FROM audit_events WHERE entity_type = 'balance-group' AND entity_id = :id`,
      { replacements: { id: groupId } },
    );
    expect(events).toEqual([
      expect.objectContaining({ action: 'balance-group.create', after: expect.objectContaining({ id: groupId }) }),
    ]);
    const list = await get(`/api/balance-groups?siteId=${siteId}`);
    expect(list.body.map((g: { id: string }) => g.id)).toEqual([groupId]);
  });

  it('refuses a meter run of another site, naming the field', async () => {
    const res = await post({
      siteId,
      name: 'Wrong site',
      inletMeterRunIds: [runs.A, runs.other],
      outletMeterRunIds: [runs.S],
      allowancePercent: 1,
      tolerancePercent: 0.5,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('inletMeterRunIds');
    expect(res.body.error.message).toMatch(/another site/);
  });

  it('refuses a meter run on both sides, naming the field', async () => {
    const res = await post({
      siteId,
      name: 'Both sides',
      inletMeterRunIds: [runs.A, runs.S],
      outletMeterRunIds: [runs.S],
      allowanceDailyM3: 100,
      tolerancePercent: 0.5,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('outletMeterRunIds');
  });

  it('wants exactly one of the two allowances', async () => {
    const base = { siteId, name: 'Allowance', inletMeterRunIds: [runs.A], outletMeterRunIds: [runs.S] };
    for (const allowance of [{}, { allowancePercent: 1, allowanceDailyM3: 100 }]) {
      const res = await post({ ...base, ...allowance, tolerancePercent: 0.5 });
      expect(res.status).toBe(400);
      expect(res.body.error.field).toBe('allowancePercent');
    }
  });
});

describe('GET /api/balance-groups/:id/balance', () => {
  it('gives a balance day, its uncertainty and its tolerance as worked by hand', async () => {
    const res = await get(`/api/balance-groups/${groupId}/balance?interval=day&from=2026-09-10&to=2026-09-12`);
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(2);
    const [d10, d11] = res.body;
    expect(d10).toMatchObject({
      start: '2026-09-10T00:00:00.000Z',
      end: '2026-09-11T00:00:00.000Z',
      inletStandardVolumeM3: 150_000,
      outletStandardVolumeM3: 147_000,
      withinTolerance: false,
      exceedsUncertainty: false,
    });
    expect(d10.allowanceM3).toBeCloseTo(1_500, 9);
    expect(d10.imbalanceM3).toBeCloseTo(1_500, 9);
    expect(d10.imbalancePercent).toBeCloseTo(1.0, 12);
    expect(d10.uncertaintyM3).toBeCloseTo(1581.27, 2);
    expect(d11.imbalanceM3).toBeCloseTo(100, 9);
    expect(d11.imbalancePercent).toBeCloseTo(100 / 1500, 12);
    expect(d11.withinTolerance).toBe(true);
  });

  it('gives the month from the monthly totals', async () => {
    const res = await get(`/api/balance-groups/${groupId}/balance?interval=month&from=2026-09-01&to=2026-10-01`);
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(1);
    expect(res.body[0].imbalanceM3).toBeCloseTo(1_000, 9);
    expect(res.body[0].imbalancePercent).toBeCloseTo(1.0, 12);
    expect(res.body[0].uncertaintyM3).toBeCloseTo(1016.85, 2);
  });

  it('refuses an interval other than day or month, naming it', async () => {
    const res = await get(`/api/balance-groups/${groupId}/balance?interval=hour&from=2026-09-10&to=2026-09-12`);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('interval');
  });
});

describe('GET /api/balance-groups/:id/allocation', () => {
  it('allocates the sales meter month pro rata to the wells, as worked by hand', async () => {
    const res = await get(`/api/balance-groups/${groupId}/allocation?month=2026-09`);
    expect(res.status).toBe(200);
    expect(res.body.sales).toMatchObject({ meterRunId: runs.S, standardVolumeM3: 98_000, energyJ: 3.92e12 });
    const wells = res.body.wells as Record<string, number>[];
    expect(wells.map((w) => w.meterRunId)).toEqual([runs.A, runs.B, runs.C]);
    expect(wells.map((w) => w.factor)).toEqual([0.6, 0.3, 0.1].map((x) => expect.closeTo(x, 12)));
    expect(wells.map((w) => w.allocatedStandardVolumeM3)).toEqual(
      [58_800, 29_400, 9_800].map((x) => expect.closeTo(x, 6)),
    );
    expect(wells.map((w) => w.allocatedEnergyJ / 1e12)).toEqual(
      [2.352, 1.2348, 0.3332].map((x) => expect.closeTo(x, 9)),
    );
    expect(wells.reduce((a, w) => a + w.allocatedStandardVolumeM3, 0)).toBeCloseTo(98_000, 6);
    expect(wells.reduce((a, w) => a + w.allocatedEnergyJ, 0) / 1e12).toBeCloseTo(3.92, 9);
  });

  it('answers 404 with the reason for a month without the sales meter total', async () => {
    const res = await get(`/api/balance-groups/${groupId}/allocation?month=2026-08`);
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/sales meter/);
  });
});

describe('the alarm balance-out-of-tolerance', () => {
  it('is raised for the day out of tolerance and returns with the next day within it', async () => {
    await judgeBalanceAlarms(t.services.pool, Date.parse('2026-09-12T00:00:00Z'));
    const [alarms] = await t.sequelize.query(
      `SELECT state, condition_active, message, detail FROM alarms
        WHERE meter_run_id = :sales AND condition = 'balance-out-of-tolerance'`,
      { replacements: { sales: runs.S } },
    );
    expect(alarms).toHaveLength(1);
    expect(alarms[0]).toMatchObject({ state: 'returned-unacknowledged', condition_active: false });
    expect((alarms[0] as { message: string }).message).toMatch(/Gathering station.*1\.00 %.*0\.50 %/);
    expect((alarms[0] as { detail: Record<string, unknown> }).detail).toMatchObject({ balanceGroupId: groupId });
  });
});
