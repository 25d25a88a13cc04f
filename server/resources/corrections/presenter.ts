import type { CorrectionRecord } from './repository';
import type { CorrectionEstimate, CorrectionWithFigures } from './use-cases';

const iso = (ms: number) => new Date(ms).toISOString();

/** A correction as JSON: id and status first (POST answers `{ id, status: "proposed", … }`), instants as ISO strings. */
export const presentCorrection = (c: CorrectionRecord) => ({
  id: c.id,
  status: c.status,
  meterRunId: c.meterRunId,
  start: iso(c.startMs),
  end: iso(c.endMs),
  kind: c.kind,
  massKg: c.massKg,
  factor: c.factor,
  substitute: c.substitute,
  origin: c.origin,
  estimate: c.estimate,
  reason: c.reason,
  proposedBy: c.proposedBy,
  proposedAt: iso(c.proposedAtMs),
  decidedBy: c.decidedBy,
  decidedAt: c.decidedAtMs === null ? null : iso(c.decidedAtMs),
  decisionReason: c.decisionReason,
});

/** A correction with the original (first recorded) and current figures of its period and their difference. */
export const presentCorrectionWithFigures = (c: CorrectionWithFigures) => ({
  ...presentCorrection(c.correction),
  figures: c.figures,
});

export const presentEstimate = (e: CorrectionEstimate) => ({
  meterRunId: e.meterRunId,
  start: iso(e.startMs),
  end: iso(e.endMs),
  massKg: e.massKg,
  uncertaintyPercent: e.uncertaintyPercent,
  method: e.method,
  basis: e.basis,
});
