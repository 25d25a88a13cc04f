/**
 * For the alarm tests: a site, meter run and DP, P and T transmitters made through the API of
 * an in-process app (testApp), and readings written through the ingest writer, as MQTT and CSV
 * ingest write them (the touched hours are queued for the history worker).
 */
import type { testApp } from '../test-support/app';

type App = Awaited<ReturnType<typeof testApp>>;
export const MIN = 60_000;
/** The DP transmitter's span: 0–50 kPa. */
export const DP_SPAN_KPA = 50;

export async function alarmFixture(
  t: App,
  token: string,
  options: { timeZone?: string; contractHour?: number; stacked?: boolean } = {},
) {
  const auth = { Authorization: `Bearer ${token}` };
  const code = t.unique().toUpperCase();
  const site = await t
    .http()
    .post('/api/sites')
    .set(auth)
    .send({
      code: `A${code}`,
      name: `Alarm test site ${code}`,
      timeZone: options.timeZone ?? 'UTC',
      contractHour: options.contractHour ?? 0,
      basePressurePa: 101325,
      baseTemperatureK: 288.15,
      atmosphericPressurePa: 101325,
    });
  if (site.status !== 201) throw new Error(`site: ${JSON.stringify(site.body)}`);
  const element = { kind: 'orifice', taps: 'flange', pipeDiameterM: 0.3, boreDiameterM: 0.1 };
  const fluid = {
    kind: 'ideal-gas',
    molarMassKgPerMol: 0.01804,
    compressibility: 1,
    isentropicExponent: 1.2,
    viscosityPaS: 1.12e-5,
  };
  const run = await t
    .http()
    .post('/api/meter-runs')
    .set(auth)
    .send({
      siteId: site.body.id,
      tag: `MR-${code}`,
      name: `Alarm test run ${code}`,
      element,
      fluid,
      holdLimitS: 3600,
      maxGapS: 300,
      effectiveFrom: '2020-01-01T00:00:00Z',
    });
  if (run.status !== 201) throw new Error(`meter run: ${JSON.stringify(run.body)}`);
  const transmitter = async (suffix: string, body: Record<string, unknown>) => {
    const res = await t
      .http()
      .post('/api/transmitters')
      .set(auth)
      .send({ meterRunId: run.body.id, tag: `MR-${code}-${suffix}`, ...body });
    if (res.status !== 201) throw new Error(`transmitter: ${JSON.stringify(res.body)}`);
    return res.body as { id: string; tag: string };
  };
  const dp = await transmitter('DP', {
    measures: 'differential-pressure',
    unit: 'kPa',
    lowerRange: 0,
    upperRange: DP_SPAN_KPA,
    ...(options.stacked ? { stackRole: 'high' } : {}),
  });
  const dpLow = options.stacked
    ? await transmitter('DPL', {
        measures: 'differential-pressure',
        unit: 'kPa',
        lowerRange: 0,
        upperRange: 5,
        stackRole: 'low',
      })
    : null;
  const pt = await transmitter('PT', {
    measures: 'static-pressure',
    unit: 'MPa',
    pressureReference: 'absolute',
    lowerRange: 0,
    upperRange: 4,
  });
  const tt = await transmitter('TT', { measures: 'temperature', unit: 'K', lowerRange: 200, upperRange: 400 });
  const meterRunId = String(run.body.id);
  const timeZone = options.timeZone ?? 'UTC';

  /**
   * Writes one reading a minute from startMs: DP as a share of span from `shares`, P near 2 MPa
   * and T near 300 K with a little variation so that only what a test means to freeze is frozen.
   */
  async function writeMinutes(
    startMs: number,
    shares: number[],
    options2: { quality?: (i: number) => number; dpValue?: (i: number, share: number) => number; only?: 'dp' } = {},
  ) {
    const readings = shares.flatMap((share, i) => {
      const timeMs = startMs + i * MIN;
      const base = { meterRunId, timeZone, timeMs };
      const out = [
        {
          ...base,
          transmitterId: dp.id,
          value: options2.dpValue?.(i, share) ?? share * DP_SPAN_KPA + (i % 2) * 0.003,
          quality: options2.quality?.(i) ?? 0,
        },
      ];
      if (options2.only !== 'dp') {
        out.push(
          { ...base, transmitterId: pt.id, value: 2 + (i % 3) * 1e-4, quality: 0 },
          { ...base, transmitterId: tt.id, value: 300 + (i % 2) * 0.01, quality: 0 },
        );
      }
      return out;
    });
    await t.services.writer.write(readings, 'csv');
  }

  return { meterRunId, siteId: String(site.body.id), tag: run.body.tag as string, dp, dpLow, pt, tt, writeMinutes };
}

export const repeat = (n: number, share: number) => new Array<number>(n).fill(share);
