/**
 * The care duties of a meter run's primary element (issue 11 §4): its laboratory calibration
 * (only for an element that takes a laboratory curve), its gas analysis and its inspection, each
 * from the latest record of its kind. The per-site "what is due" list and the care alarms both
 * read them, and judge their dates with judgeDueDate (due-date.ts).
 */
export const CARE_RECORD_KINDS = ['element-calibration', 'gas-analysis', 'element-inspection'] as const;
export type CareRecordKind = (typeof CARE_RECORD_KINDS)[number];

/** The latest record of a kind: the date it was done and the next due date it set (if any), YYYY-MM-DD. */
export interface LatestCareRecord {
  doneOn: string;
  dueOn: string | null;
}

export interface CareSubject {
  elementKind: string | null;
  /** The element in force carries a laboratory curve of C against Re_D. */
  elementHasCurve: boolean;
  latest: Record<CareRecordKind, LatestCareRecord | null>;
}

export interface CareDuty {
  kind: CareRecordKind;
  lastDoneOn: string | null;
  dueOn: string | null;
}

/**
 * A cone's C is taken from a laboratory calibration as a rule (the uncalibrated value of
 * ISO 5167-5 carries a wide uncertainty [mem]); any other element takes a curve once one is in
 * force or recorded. An orifice, nozzle or venturi with its standard C has no calibration duty.
 */
export function takesLaboratoryCurve(subject: CareSubject): boolean {
  return subject.elementKind === 'cone' || subject.elementHasCurve || subject.latest['element-calibration'] !== null;
}

/** @returns the meter run's duties in the order of CARE_RECORD_KINDS */
export function careDuties(subject: CareSubject): CareDuty[] {
  return CARE_RECORD_KINDS.filter((kind) => kind !== 'element-calibration' || takesLaboratoryCurve(subject)).map(
    (kind) => ({
      kind,
      lastDoneOn: subject.latest[kind]?.doneOn ?? null,
      dueOn: subject.latest[kind]?.dueOn ?? null,
    }),
  );
}
