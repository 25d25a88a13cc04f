import { configVersionSchema, meterRunSchema, transmitterSchema } from './setup';

const element = { kind: 'cone', pipeDiameterM: 0.1, coneDiameterM: 0.08, dischargeCoefficient: 0.8 };
const reverseElement = { ...element, dischargeCoefficient: 0.76 };
const fluid = { kind: 'water' };
const meterRun = { siteId: '1', tag: 'BI-1', name: 'Bi-directional run', element, fluid };
const issuesOf = (result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  (result.error?.issues ?? []).map((i) => ({ path: i.path.join('.'), message: i.message }));

describe('meterRunSchema for bi-directional meter runs', () => {
  it('accepts a bi-directional meter run with its reverse element and direction source', () => {
    const r = meterRunSchema.safeParse({
      ...meterRun,
      line: { bidirectional: true },
      reverseElement,
      directionSource: 'direction-input',
    });
    expect(r.success).toBe(true);
    expect(r.data?.reverseElement).toEqual(reverseElement);
  });

  it('refuses line.bidirectional without reverseElement, naming reverseElement', () => {
    const r = meterRunSchema.safeParse({ ...meterRun, line: { bidirectional: true } });
    expect(issuesOf(r)).toEqual([
      {
        path: 'reverseElement',
        message: "required for a bi-directional meter run: the element's constants in reverse flow",
      },
    ]);
  });

  it('refuses reverseElement on a meter run not marked bi-directional, naming line.bidirectional', () => {
    const r = meterRunSchema.safeParse({ ...meterRun, reverseElement });
    expect(issuesOf(r).map((i) => i.path)).toEqual(['line.bidirectional']);
  });

  it('refuses directionSource without reverseElement, naming directionSource', () => {
    const r = meterRunSchema.safeParse({ ...meterRun, directionSource: 'dp-sign' });
    expect(issuesOf(r).map((i) => i.path)).toEqual(['directionSource']);
  });

  it('keeps a one-way meter run as it was', () => {
    expect(meterRunSchema.safeParse(meterRun).success).toBe(true);
  });
});

describe('configVersionSchema for bi-directional meter runs', () => {
  const version = { effectiveFrom: '2026-11-01T15:00:00Z', element, fluid, reason: 'made bi-directional' };

  it('accepts a version that adds a reverse element, and one without', () => {
    expect(configVersionSchema.safeParse({ ...version, reverseElement }).success).toBe(true);
    expect(configVersionSchema.safeParse(version).success).toBe(true);
  });

  it('refuses directionSource without reverseElement, naming directionSource', () => {
    const r = configVersionSchema.safeParse({ ...version, directionSource: 'direction-input' });
    expect(issuesOf(r).map((i) => i.path)).toEqual(['directionSource']);
  });

  it('refuses an unknown direction source, naming directionSource', () => {
    const r = configVersionSchema.safeParse({ ...version, reverseElement, directionSource: 'guess' });
    expect(issuesOf(r).map((i) => i.path)).toEqual(['directionSource']);
  });
});

describe('transmitterSchema for a direction input', () => {
  const transmitter = { meterRunId: '1', tag: 'BI-1-DIR', lowerRange: -1, upperRange: 1 };

  it("accepts measure flow-direction with unit 'sign'", () => {
    expect(transmitterSchema.safeParse({ ...transmitter, measures: 'flow-direction', unit: 'sign' }).success).toBe(
      true,
    );
  });

  it("refuses a direction input in a pressure unit and a pressure transmitter in 'sign', naming unit", () => {
    const a = transmitterSchema.safeParse({ ...transmitter, measures: 'flow-direction', unit: 'kPa' });
    expect(issuesOf(a)).toEqual([{ path: 'unit', message: "a direction input needs the unit 'sign'" }]);
    const b = transmitterSchema.safeParse({ ...transmitter, measures: 'differential-pressure', unit: 'sign' });
    expect(issuesOf(b).map((i) => i.path)).toEqual(['unit']);
    const c = transmitterSchema.safeParse({ ...transmitter, measures: 'temperature', unit: 'sign' });
    expect(issuesOf(c).map((i) => i.path)).toEqual(['unit']);
  });
});
