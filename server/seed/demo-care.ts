/**
 * The demo's transmitter calibrations (SCENARIO.md: every transmitter has a calibration within
 * the last year except KFG-102-DP, which is overdue), recorded through the calibrations use case
 * as the demo engineer, so the "Care due" screen and the calibration alarms have something to
 * show: KFG-102-DP overdue, and KFG-201-DP (calibrated 355 days ago, yearly) due within the
 * alarms' 14-day window. Dates are on the KFG site's calendar at the time of the seed.
 *
 * Idempotent: a transmitter that has any calibration recorded is left alone.
 */
import { DateTime } from 'luxon';
import type { Sequelize } from 'sequelize';
import { todayIn } from '../../shared/alarms/due-date';
import { DEMO_SITES, KFG_SITE } from '../../simulators/scenario';
import { calibrationRepository } from '../resources/calibrations/repository';
import { recordCalibration } from '../resources/calibrations/use-cases';

const DEMO_ENGINEER = 'engineer@demo.tallyrun';
/** Calibrated this many days before the seed, due a year after. */
const OVERDUE_TAG = 'KFG-102-DP';
const OVERDUE_AGE_DAYS = 400;
const DUE_SOON_TAG = 'KFG-201-DP';
const DUE_SOON_AGE_DAYS = 355;

/** @returns how many calibrations were recorded */
export async function seedDemoCare(sequelize: Sequelize, options: { nowMs?: number } = {}): Promise<number> {
  const q = async <T>(sql: string, replacements: Record<string, unknown> = {}) =>
    (await sequelize.query(sql, { replacements }))[0] as T[];
  const [actor] = await q<{ id: string; email: string; name: string; role: 'engineer' }>(
    "SELECT id::text, email, name, role FROM users WHERE lower(email) = :email AND role = 'engineer'",
    { email: DEMO_ENGINEER },
  );
  if (!actor) return 0;
  const transmitters = await q<{ id: string; tag: string }>(
    `SELECT t.id::text, t.tag FROM transmitters t JOIN meter_runs m ON m.id = t.meter_run_id JOIN sites s ON s.id = m.site_id
      WHERE s.code IN (:codes) AND NOT EXISTS (SELECT 1 FROM transmitter_calibrations c WHERE c.transmitter_id = t.id)
      ORDER BY t.tag`,
    { codes: DEMO_SITES.map((s) => s.code) },
  );
  const repository = calibrationRepository(sequelize);
  const today = DateTime.fromISO(todayIn(options.nowMs ?? Date.now(), KFG_SITE.timeZone));
  let recorded = 0;
  for (const [i, t] of transmitters.entries()) {
    const transmitter = await repository.transmitter(t.id);
    if (!transmitter) continue;
    // Spread the others over the last year, 30 to 330 days ago: all in date, none within 14 days of due.
    const ageDays =
      t.tag === OVERDUE_TAG ? OVERDUE_AGE_DAYS : t.tag === DUE_SOON_TAG ? DUE_SOON_AGE_DAYS : 30 + ((i * 37) % 300);
    const calibratedOn = today.minus({ days: ageDays });
    const { lowerRange: lo, upperRange: hi } = transmitter;
    const at = (share: number) => lo + (hi - lo) * share;
    await recordCalibration(
      { sequelize, repository },
      {
        transmitterId: t.id,
        input: {
          calibratedOn: calibratedOn.toISODate()!,
          laboratory: 'Kestrel Flats field instrument shop',
          performedBy: 'Demo engineer',
          asFound: [0, 0.5, 1].map((s) => ({ appliedValue: at(s), indicatedValue: at(s) })),
          asLeft: [0, 0.5, 1].map((s) => ({ appliedValue: at(s), indicatedValue: at(s) })),
          nextDue: calibratedOn.plus({ years: 1 }).toISODate()!,
          notes: 'Demo record.',
        },
        keepCertificate: null,
        actor,
      },
    );
    recorded++;
  }
  return recorded;
}
