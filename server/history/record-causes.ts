/**
 * Why a record has the figures it has (issue 9, traceable records). Every version of an hourly
 * record or of a contract-day or contract-month total names what made it; the stale-hours queue
 * carries the reason an hour waits, and the worker hands it to the record it writes.
 */

/** What made a version of a record. */
export type RecordCause = 'initial' | 'late-readings' | 'configuration-version' | 'correction' | 'reopen' | 'scheduled';

/** Why an hour is recomputed; `reference` names the thing behind it where known (a configuration version id). */
export interface RecomputeReason {
  cause: Exclude<RecordCause, 'initial'>;
  reference: string | null;
}

/** The hourly sweep's reason, and the reason of a recompute nobody explained. */
export const scheduled: RecomputeReason = { cause: 'scheduled', reference: null };

/** The more specific reason wins when several hours of one contract day or month were recomputed for different reasons. */
const weight: Record<RecomputeReason['cause'], number> = {
  scheduled: 0,
  'late-readings': 1,
  'configuration-version': 2,
  reopen: 3,
  correction: 4,
};

/** @returns the most specific of the reasons (`scheduled` when there are none) */
export function strongestReason(reasons: Iterable<RecomputeReason>): RecomputeReason {
  let best = scheduled;
  for (const r of reasons) if (weight[r.cause] > weight[best.cause]) best = r;
  return best;
}
