import { Router } from 'express';
import type { Pool } from 'pg';
import { z } from 'zod';
import { quantile } from 'simple-statistics';
import { requireCapability } from '../../auth/passport';
import { badRequest, notFound } from '../../errors';
import { validate } from '../validate';
import { loadMeterRunContext } from '../../history/load-context';
import { contractDayOf } from '../../../shared/history/contract-day';
import { bandShares, type BandHour } from '../../../shared/range-health/band-shares';
import { rangeAdvice } from '../../../shared/range-health/range-advice';
import {
  DENSITY_MODEL_UNCERTAINTY_PERCENT,
  ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
  PIPE_DIAMETER_UNCERTAINTY_PERCENT,
} from '../../../shared/history/sample-uncertainty';
import { toSI } from '../../../shared/units';
import type { DpBandName } from '../../../shared/history/types';

const isoTime = z.iso.datetime({ offset: true, error: 'must be ISO 8601 with an offset or Z' });
const dayMs = 86_400_000;
/** Hours shorter than this in flow are left out of the flow range (a start-up minute is not a rate). */
const MIN_FLOW_TIME_FOR_RATE_S = 600;

/**
 * Range health of a meter run (`GET /api/meter-runs/:id/range-health?from&to`): the share of
 * flowing time, mass and standard volume in each band of the active DP span, per DP transmitter
 * of a stacked pair, the uncertainty each band contributes, the shares month by month, and a
 * recommendation from the range check. Every role may read it (it is a view of the totals); the
 * engineer acts on it.
 *
 * Per transmitter: an hour in which one DP transmitter was in use all its flowing time is
 * attributed to it exactly; an hour in which both were in use (the pair switched) is shared out
 * in proportion to each one's time in use, and the response says how much flowing time was
 * shared out that way (attribution.apportionedFlowTimeS).
 */
export function meterRunRangeHealthRouter(pool: Pool) {
  const router = Router();

  router.get('/:id/range-health', requireCapability('view'), async (req, res) => {
    const id = String(req.params.id);
    if (!/^\d+$/.test(id)) throw notFound('Meter run');
    const q = validate(
      z.object({
        from: isoTime,
        to: isoTime,
        uncertaintyLimitPercent: z.coerce.number().positive('must be above 0').max(10, 'must be at most 10').default(1),
      }),
      req.query,
      'query',
    );
    const fromMs = Date.parse(q.from);
    const toMs = Date.parse(q.to);
    if (toMs <= fromMs) throw badRequest('to: must be after from', 'to');
    if (toMs - fromMs > 400 * dayMs) throw badRequest('to: at most 400 days per request', 'to');
    const ctx = await loadMeterRunContext(pool, id);
    if (!ctx) throw notFound('Meter run');
    const tags = new Map(
      (await pool.query('SELECT id::text, tag FROM transmitters WHERE meter_run_id = $1', [id])).rows.map((r) => [
        r.id as string,
        r.tag as string,
      ]),
    );
    const dps = ctx.transmitters.filter((t) => t.measures === 'differential-pressure');
    const { rows } = await pool.query(
      `SELECT start, flow_time_s, mass_kg, standard_volume_m3, uncertainty_percent, dp_bands, active_transmitter_time, average_pressure_pa, average_temperature_k
         FROM hourly_records WHERE meter_run_id = $1 AND start >= to_timestamp($2 / 1000.0) AND start < to_timestamp($3 / 1000.0) ORDER BY start`,
      [id, fromMs, toMs],
    );
    const hours = rows.map((r) => ({
      startMs: (r.start as Date).getTime(),
      flowTimeS: r.flow_time_s as number,
      massKg: r.mass_kg as number,
      standardVolumeM3: r.standard_volume_m3 as number,
      uncertaintyPercent: r.uncertainty_percent as number | null,
      dpBands: (r.dp_bands ?? {}) as Partial<Record<DpBandName, { timeS: number; massKg: number }>>,
      active: (r.active_transmitter_time ?? {}) as Record<string, number>,
      pressurePa: r.average_pressure_pa as number | null,
      temperatureK: r.average_temperature_k as number | null,
    }));

    const summary = bandShares(hours);

    // Per DP transmitter: whole hours where it alone was in use, shares of the others.
    let apportionedFlowTimeS = 0;
    const perTransmitter = new Map<string, BandHour[]>(dps.map((t) => [t.id, []]));
    for (const h of hours) {
      const inUse = dps.filter((t) => (h.active[t.id] ?? 0) > 0);
      const totalActive = inUse.reduce((a, t) => a + h.active[t.id], 0);
      if (inUse.length > 1) apportionedFlowTimeS += h.flowTimeS;
      for (const t of inUse) {
        const f = inUse.length === 1 ? 1 : h.active[t.id] / totalActive;
        const scaled: BandHour['dpBands'] = {};
        for (const [band, v] of Object.entries(h.dpBands))
          scaled[band as DpBandName] = { timeS: v!.timeS * f, massKg: v!.massKg * f };
        perTransmitter
          .get(t.id)!
          .push({
            flowTimeS: h.flowTimeS * f,
            massKg: h.massKg * f,
            standardVolumeM3: h.standardVolumeM3 * f,
            uncertaintyPercent: h.uncertaintyPercent,
            dpBands: scaled,
          });
      }
    }
    const transmitters = dps.map((t) => {
      const s = bandShares(perTransmitter.get(t.id)!);
      const activeTimeS = hours.reduce((a, h) => a + (h.active[t.id] ?? 0), 0);
      return {
        transmitterId: t.id,
        tag: tags.get(t.id) ?? t.id,
        stackRole: t.stackRole,
        unit: t.unit,
        lowerRange: t.lowerRange,
        upperRange: t.upperRange,
        accuracyPercentOfSpan: t.accuracyPercentOfSpan,
        activeTimeS,
        flowTimeShare: summary.flowTimeS > 0 ? s.flowTimeS / summary.flowTimeS : 0,
        massShare: summary.massKg > 0 ? s.massKg / summary.massKg : 0,
        ...s,
      };
    });

    // Month by month (contract months of the site), for the trend of a well drifting down the span.
    const byMonth = new Map<string, typeof hours>();
    for (const h of hours) {
      const month = contractDayOf(h.startMs, ctx.timeZone, ctx.contractHour).slice(0, 7);
      byMonth.set(month, [...(byMonth.get(month) ?? []), h]);
    }
    const months = [...byMonth.entries()].map(([month, list]) => {
      const s = bandShares(list);
      return {
        month,
        flowTimeS: s.flowTimeS,
        massKg: s.massKg,
        standardVolumeM3: s.standardVolumeM3,
        uncertaintyPercent: s.uncertaintyPercent,
        bands: Object.fromEntries(
          s.bands.map((b) => [
            b.band,
            { flowTimeShare: b.flowTimeShare, massShare: b.massShare, standardVolumeShare: b.standardVolumeShare },
          ]),
        ),
      };
    });

    res.json({
      meterRunId: id,
      from: new Date(fromMs).toISOString(),
      to: new Date(toMs).toISOString(),
      hours: hours.length,
      ...summary,
      transmitters,
      attribution: {
        method: 'whole hours exact; hours with a switch of the pair shared out by time in use',
        apportionedFlowTimeS,
      },
      months,
      recommendation: recommend(),
    });

    function recommend() {
      const rates = hours
        .filter((h) => h.flowTimeS >= MIN_FLOW_TIME_FOR_RATE_S && h.massKg > 0)
        .map((h) => h.massKg / h.flowTimeS);
      const version = [...ctx!.configVersions].reverse().find((v) => v.effectiveFromMs < toMs);
      if (!rates.length || !version || !dps.length) {
        return {
          kind: 'unavailable',
          text: 'No recommendation: the period has no hour with flow (or the meter run has no DP transmitter or configuration).',
          numbers: {},
        };
      }
      const weighted = (pick: (h: (typeof hours)[number]) => number | null) => {
        let num = 0;
        let den = 0;
        for (const h of hours) {
          const v = pick(h);
          if (v !== null && h.massKg > 0) {
            num += v * h.massKg;
            den += h.massKg;
          }
        }
        return den > 0 ? num / den : null;
      };
      const pressurePa = weighted((h) => h.pressurePa);
      const temperatureK = weighted((h) => h.temperatureK);
      if (pressurePa === null || temperatureK === null)
        return {
          kind: 'unavailable',
          text: 'No recommendation: no average pressure and temperature in the period.',
          numbers: {},
        };
      const band = (name: DpBandName) => summary.bands.find((b) => b.band === name)!;
      try {
        const advice = rangeAdvice({
          element: version.element,
          fluid: version.fluid,
          conditions: { staticPressurePa: pressurePa, temperatureK },
          // The lowest hourly rate is the 5th percentile, so a start-up hour does not set it.
          flowRange: {
            minimumKgPerS: quantile(rates, 0.05),
            normalKgPerS: quantile(rates, 0.5),
            maximumKgPerS: Math.max(...rates),
          },
          transmitters: dps.map((t) => ({
            id: t.id,
            tag: tags.get(t.id) ?? t.id,
            stackRole: t.stackRole,
            spanPa: toSI(t.upperRange, t.unit) - toSI(t.lowerRange, t.unit),
            accuracyPercentOfSpan: t.accuracyPercentOfSpan,
            unit: t.unit,
          })),
          lowInRangeTimeShare: band('0-10').flowTimeShare,
          overRangeTimeShare: band('over').flowTimeShare,
          uncertaintyLimitPercent: q.uncertaintyLimitPercent,
          pipeDiameterPercent: PIPE_DIAMETER_UNCERTAINTY_PERCENT,
          elementDiameterPercent: ELEMENT_DIAMETER_UNCERTAINTY_PERCENT,
          densityPercent: DENSITY_MODEL_UNCERTAINTY_PERCENT[version.fluid.kind] ?? 0,
        });
        const rc = advice.rangeCheck;
        return {
          kind: advice.kind,
          text: advice.text,
          numbers: advice.numbers,
          rangeCheck: {
            rangeCovered: rc.rangeCovered,
            flows: rc.flows.map((f) => ({
              label: f.label,
              massFlowKgPerS: f.massFlowKgPerS,
              differentialPressurePa: f.differentialPressurePa,
              transmitters: f.transmitters,
            })),
            transmitters: rc.transmitters,
            suggestedLowRangeSpan: rc.suggestedLowRangeSpan,
            warnings: rc.warnings,
          },
        };
      } catch (err) {
        return {
          kind: 'unavailable',
          text: `No recommendation: the range check failed (${err instanceof Error ? err.message : String(err)}).`,
          numbers: {},
        };
      }
    }
  });

  return router;
}
