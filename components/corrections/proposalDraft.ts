/**
 * The propose form's draft and its turn into a request: the period typed on the site's clock
 * (a date and a whole hour), what is corrected, and the reason. Problems are named per field,
 * with the server's field names, so a refusal from the server lands under the same field.
 */
import { zonedIso } from '@/components/setup/zonedTime';
import type { CorrectionProposal } from './api';

export type CorrectionMode = 'quantity' | 'readings' | 'factor';

export interface ProposalDraft {
  meterRunId: string;
  startDate: string;
  startTime: string;
  endDate: string;
  endTime: string;
  mode: CorrectionMode;
  /** kg, as typed. */
  massKg: string;
  /** 'estimate' while massKg is the estimate the server gave; typing a quantity makes it 'manual'. */
  origin: 'manual' | 'estimate';
  transmitterId: string;
  /** In the transmitter's own unit, as typed. */
  value: string;
  hold: boolean;
  factor: string;
  reason: string;
}

export const emptyDraft: ProposalDraft = {
  meterRunId: '',
  startDate: '',
  startTime: '00:00',
  endDate: '',
  endTime: '00:00',
  mode: 'quantity',
  massKg: '',
  origin: 'manual',
  transmitterId: '',
  value: '',
  hold: false,
  factor: '',
  reason: '',
};

export type DraftErrors = Partial<Record<string, string>>;

const number = (text: string) => (text.trim() === '' ? Number.NaN : Number(text.trim().replace(',', '.')));
const wholeHour = /^([01]\d|2[0-3]):00$/;

/** The period as instants on the site's clock, or the problems with it. */
export function periodOf(draft: ProposalDraft, timeZone: string): { start: string; end: string } | DraftErrors {
  const errors: DraftErrors = {};
  if (!/^\d{4}-\d{2}-\d{2}$/.test(draft.startDate)) errors.start = 'Give the start date as YYYY-MM-DD.';
  else if (!wholeHour.test(draft.startTime)) errors.start = 'Give the start as a whole hour, e.g. 09:00.';
  if (!/^\d{4}-\d{2}-\d{2}$/.test(draft.endDate)) errors.end = 'Give the end date as YYYY-MM-DD.';
  else if (!wholeHour.test(draft.endTime)) errors.end = 'Give the end as a whole hour, e.g. 10:00.';
  if (Object.keys(errors).length) return errors;
  const start = zonedIso(draft.startDate, draft.startTime, timeZone);
  const end = zonedIso(draft.endDate, draft.endTime, timeZone);
  if (!(Date.parse(end) > Date.parse(start))) return { end: 'The end must be after the start.' };
  return { start, end };
}

/**
 * @param draft the form as typed
 * @param timeZone the site's zone
 * @returns the request, or the problems by field (meterRunId, start, end, massKg, factor, substitute.transmitterId, substitute.value, reason)
 */
export function proposalFromDraft(
  draft: ProposalDraft,
  timeZone: string,
): { ok: true; proposal: CorrectionProposal } | { ok: false; errors: DraftErrors } {
  const errors: DraftErrors = {};
  if (!draft.meterRunId) errors.meterRunId = 'Choose the meter run.';
  const period = periodOf(draft, timeZone);
  if (!('start' in period && 'end' in period && period.start && period.end)) Object.assign(errors, period);
  const proposal: Partial<CorrectionProposal> = { meterRunId: draft.meterRunId, reason: draft.reason.trim() };
  if (draft.mode === 'quantity') {
    const massKg = number(draft.massKg);
    if (!(massKg >= 0)) errors.massKg = 'Give the mass for the period in kg (0 or more).';
    Object.assign(proposal, { kind: 'substitute', massKg, origin: draft.origin });
  } else if (draft.mode === 'factor') {
    const factor = number(draft.factor);
    if (!(factor > 0)) errors.factor = 'Give a factor above 0, e.g. 1.02.';
    Object.assign(proposal, { kind: 'adjust', factor });
  } else {
    const value = number(draft.value);
    if (!draft.transmitterId) errors['substitute.transmitterId'] = 'Choose the transmitter.';
    if (!draft.hold && !Number.isFinite(value))
      errors['substitute.value'] = 'Give the value in the transmitter’s unit, or hold the last value.';
    Object.assign(proposal, {
      kind: 'substitute',
      substitute: draft.hold
        ? { transmitterId: draft.transmitterId, hold: true }
        : { transmitterId: draft.transmitterId, value },
    });
  }
  if (!proposal.reason) errors.reason = 'Say why the figures are corrected.';
  if (Object.keys(errors).length) return { ok: false, errors };
  const { start, end } = period as { start: string; end: string };
  return { ok: true, proposal: { ...(proposal as CorrectionProposal), start, end } };
}
