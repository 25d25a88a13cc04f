import { DateTime } from 'luxon';
import { testApp } from '../test-support/app';
import { checkPassword } from '../auth/passwords';
import {
  configVersionSchema,
  lineSchema,
  meterRunSchema,
  siteSchema,
  transmitterSchema,
} from '../../shared/schemas/setup';
import { DEMO_METER_RUNS, DEMO_SITES, DEMO_TRANSMITTERS, scenarioTimeline } from '../../simulators/scenario';
import { demoScenarioRows, seedDemoScenario } from './demo-scenario';
import { seedDemoUsers } from './demo-users';

type Ctx = Awaited<ReturnType<typeof testApp>>;
let ctx: Ctx;
beforeAll(async () => {
  ctx = await testApp();
});
afterAll(() => ctx.close());

const nowMs = Date.parse('2026-12-02T00:00:00Z');
const demoPassword = 'tallyrun-demo';
const siteCodes = DEMO_SITES.map((s) => s.code);
const runTags = DEMO_METER_RUNS.map((m) => m.tag);
const transmitterTags = DEMO_TRANSMITTERS.map((t) => t.transmitter.tag);
const usernames = DEMO_SITES.map((s) => s.device.username);

async function rows(sql: string, replacements: Record<string, unknown> = {}) {
  const [r] = await ctx.sequelize.query(sql, { replacements });
  return r as Record<string, any>[];
}
async function demoCounts() {
  return {
    sites: (await rows('SELECT count(*)::int n FROM sites WHERE code IN (:siteCodes)', { siteCodes }))[0].n,
    meterRuns: (await rows('SELECT count(*)::int n FROM meter_runs WHERE tag IN (:runTags)', { runTags }))[0].n,
    configVersions: (
      await rows(
        'SELECT count(*)::int n FROM config_versions c JOIN meter_runs m ON m.id = c.meter_run_id WHERE m.tag IN (:runTags)',
        { runTags },
      )
    )[0].n,
    transmitters: (
      await rows('SELECT count(*)::int n FROM transmitters WHERE tag IN (:transmitterTags)', { transmitterTags })
    )[0].n,
    devices: (await rows('SELECT count(*)::int n FROM devices WHERE username IN (:usernames)', { usernames }))[0].n,
    balanceGroups: (
      await rows(
        "SELECT count(*)::int n FROM balance_groups g JOIN sites s ON s.id = g.site_id WHERE s.code = 'KFG' AND g.name = 'Kestrel Flats'",
      )
    )[0].n,
  };
}

describe('seedDemoScenario', () => {
  let first: Awaited<ReturnType<typeof seedDemoScenario>>;
  beforeAll(async () => {
    // The balance group is recorded as made by the demo engineer, so the demo users come first (as at start).
    await seedDemoUsers(ctx.sequelize, demoPassword);
    first = await seedDemoScenario(ctx.sequelize, { demoPassword, nowMs });
  });

  it('holds the two sites, seven meter runs, eight configuration versions, 22 transmitters, two devices and the balance group of SCENARIO.md', async () => {
    expect(await demoCounts()).toEqual({
      sites: 2,
      meterRuns: 7,
      configVersions: 8,
      transmitters: 22,
      devices: 2,
      balanceGroups: 1,
    });
  });

  // Counted over the demo's own rows: other test files write sites and meter runs to the same
  // database at the same time, so a count of whole tables would change under this test.
  it("creates nothing on a second run and leaves the demo's row counts as they were", async () => {
    const before = await demoCounts();
    const second = await seedDemoScenario(ctx.sequelize, { demoPassword, nowMs });
    expect(second).toEqual({
      demoMonth: '2026-11',
      sites: 0,
      meterRuns: 0,
      configVersions: 0,
      transmitters: 0,
      devices: 0,
      balanceGroups: 0,
    });
    expect(await demoCounts()).toEqual(before);
  });

  it('stores rows that pass the shared set-up schemas', async () => {
    for (const s of await rows('SELECT * FROM sites WHERE code IN (:siteCodes)', { siteCodes })) {
      expect(
        siteSchema.safeParse({
          code: s.code,
          name: s.name,
          timeZone: s.time_zone,
          contractHour: s.contract_hour,
          basePressurePa: s.base_pressure_pa,
          baseTemperatureK: s.base_temperature_k,
          atmosphericPressurePa: s.atmospheric_pressure_pa,
          displayUnits: s.display_units,
        }).success,
      ).toBe(true);
    }
    for (const m of await rows('SELECT * FROM meter_runs WHERE tag IN (:runTags)', { runTags })) {
      const versions = await rows('SELECT * FROM config_versions WHERE meter_run_id = :id ORDER BY effective_from', {
        id: m.id,
      });
      expect(lineSchema.safeParse(m.line).success).toBe(true);
      const parsed = meterRunSchema.safeParse({
        siteId: String(m.site_id),
        tag: m.tag,
        name: m.name,
        element: versions[0].element,
        fluid: versions[0].fluid,
        holdLimitS: m.hold_limit_s,
        maxGapS: m.max_gap_s,
        stackSwitchUpShare: m.stack_switch_up_share,
        stackSwitchDownShare: m.stack_switch_down_share,
        line: m.line,
      });
      expect({ tag: m.tag, ok: parsed.success }).toEqual({ tag: m.tag, ok: true });
      for (const v of versions)
        expect(
          configVersionSchema.safeParse({
            effectiveFrom: (v.effective_from as Date).toISOString(),
            element: v.element,
            fluid: v.fluid,
            reason: v.reason,
          }).success,
        ).toBe(true);
    }
    for (const t of await rows('SELECT * FROM transmitters WHERE tag IN (:transmitterTags)', { transmitterTags })) {
      const parsed = transmitterSchema.safeParse({
        meterRunId: String(t.meter_run_id),
        tag: t.tag,
        measures: t.measures,
        unit: t.unit,
        pressureReference: t.pressure_reference,
        lowerRange: t.lower_range,
        upperRange: t.upper_range,
        stackRole: t.stack_role,
        accuracyPercentOfSpan: t.accuracy_percent_of_span,
      });
      expect({ tag: t.tag, ok: parsed.success }).toEqual({ tag: t.tag, ok: true });
    }
  });

  it('gives KFG its base conditions in SI: 60 °F = 288.7056 K and 14.73 psia = 101 559.8 Pa (1 psi = 6894.757 Pa, NIST SP 811 [mem])', async () => {
    const [kfg] = await rows("SELECT * FROM sites WHERE code = 'KFG'");
    expect(kfg.base_temperature_k).toBeCloseTo(288.705556, 5); // (60 + 459.67) × 5/9
    expect(kfg.base_pressure_pa).toBeCloseTo(101559.8, 1);
    expect(kfg.time_zone).toBe('America/Denver');
    expect(kfg.contract_hour).toBe(9);
    expect(kfg.display_units).toBe('us');
  });

  it("records KFG-101's element change as a second configuration version at 14:00 Denver time on day 20, with a β 0.45 cone", async () => {
    const versions = await rows(
      "SELECT c.* FROM config_versions c JOIN meter_runs m ON m.id = c.meter_run_id WHERE m.tag = 'KFG-101' ORDER BY effective_from",
    );
    expect(versions).toHaveLength(2);
    const local = DateTime.fromJSDate(versions[1].effective_from as Date, { zone: 'America/Denver' });
    expect([local.day, local.hour, local.minute]).toEqual([20, 14, 0]);
    const { pipeDiameterM, coneDiameterM } = versions[1].element;
    expect(Math.sqrt(1 - (coneDiameterM / pipeDiameterM) ** 2)).toBeCloseTo(0.45, 4); // ISO 5167-5 β
    expect(versions[1].reason).toMatch(/0\.45/);
  });

  it('dates the element change 2026-11-20T21:00Z for a seed run on 2 December 2026 (MST is UTC−7 after 1 November 2026)', () => {
    const { meterRuns } = demoScenarioRows(scenarioTimeline('2026-11'));
    const kfg101 = meterRuns.find((m) => m.run.tag === 'KFG-101')!;
    expect(kfg101.versions.map((v) => v.effectiveFrom)).toEqual([
      '2026-11-01T16:00:00.000Z',
      '2026-11-20T21:00:00.000Z',
    ]);
  });

  it('stores each device password bcrypt-hashed, derived from the demo password as `${demoPassword}-device`', async () => {
    for (const d of await rows('SELECT * FROM devices WHERE username IN (:usernames)', { usernames })) {
      expect(d.password_hash).toMatch(/^\$2[aby]\$10\$/);
      expect(d.password_hash).not.toContain(demoPassword);
      // Only this run's seed is sure to have used this demo password.
      if (first.devices === 2) expect(await checkPassword(`${demoPassword}-device`, d.password_hash)).toBe(true);
    }
  });

  it("never overwrites an engineer's later edits", async () => {
    const [site] = await rows("SELECT name FROM sites WHERE code = 'KFG'");
    const [dpl] = await rows("SELECT upper_range FROM transmitters WHERE tag = 'KFG-101-DPL'");
    await rows("UPDATE sites SET name = 'Kestrel Flats (renamed)' WHERE code = 'KFG'");
    await rows("UPDATE transmitters SET upper_range = 30 WHERE tag = 'KFG-101-DPL'");
    try {
      await seedDemoScenario(ctx.sequelize, { demoPassword, nowMs });
      expect((await rows("SELECT name FROM sites WHERE code = 'KFG'"))[0].name).toBe('Kestrel Flats (renamed)');
      expect((await rows("SELECT upper_range FROM transmitters WHERE tag = 'KFG-101-DPL'"))[0].upper_range).toBe(30);
    } finally {
      await rows("UPDATE sites SET name = :name WHERE code = 'KFG'", { name: site.name });
      await rows("UPDATE transmitters SET upper_range = :u WHERE tag = 'KFG-101-DPL'", { u: dpl.upper_range });
    }
  });

  it('refuses to run without a demo password', async () => {
    await expect(seedDemoScenario(ctx.sequelize, { demoPassword: '' })).rejects.toThrow(
      /seedDemoScenario: options.demoPassword/,
    );
  });
});
