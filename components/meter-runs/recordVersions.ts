/**
 * Every version of one hourly record or contract-day total (GET /api/meter-runs/:id/hourly-records/versions
 * and /totals/versions), and the first-versus-current comparison the screen shows: each quantity
 * first, current, their difference and the difference as a share of the first.
 */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { formatNumber, type DisplayUnitSet } from '@/constants/units-display';
import { apiRequest } from '@/hooks/api/client';
import { fromSI } from '@/shared/units';

const versionSchema = z.object({
  version: z.number(),
  cause: z.string(),
  causeReference: z.string().nullable(),
  start: z.string(),
  end: z.string(),
  massKg: z.number(),
  volumeM3: z.number(),
  standardVolumeM3: z.number(),
  energyJ: z.number().nullable(),
  coverage: z.number(),
  flags: z.array(z.string()),
  uncertaintyPercent: z.number().nullable(),
  computedAt: z.string(),
  supersededAt: z.string().nullable(),
});
export type RecordVersion = z.infer<typeof versionSchema>;

const historySchema = z.object({
  current: versionSchema,
  versions: z.array(versionSchema),
  first: versionSchema,
  difference: z.object({
    massKg: z.number(),
    volumeM3: z.number(),
    standardVolumeM3: z.number(),
    energyJ: z.number().nullable(),
  }),
});
export type RecordHistory = z.infer<typeof historySchema>;

/** Which record: an hour by its start instant, or a contract day by its start instant. */
export interface RecordRef {
  kind: 'hour' | 'day';
  start: string;
}

export const recordVersionKeys = {
  all: ['record-versions'] as const,
  one: (meterRunId: string, ref: RecordRef) => [...recordVersionKeys.all, meterRunId, ref.kind, ref.start] as const,
};

/** @param ref the record whose versions to fetch; nothing is fetched while it is null */
export function useRecordVersions(meterRunId: string, ref: RecordRef | null) {
  return useQuery({
    queryKey: ref ? recordVersionKeys.one(meterRunId, ref) : [...recordVersionKeys.all, meterRunId, 'none'],
    queryFn: ({ signal }) =>
      apiRequest({
        path:
          ref?.kind === 'hour'
            ? `/meter-runs/${encodeURIComponent(meterRunId)}/hourly-records/versions`
            : `/meter-runs/${encodeURIComponent(meterRunId)}/totals/versions`,
        query: ref?.kind === 'hour' ? { start: ref.start } : { interval: 'day', start: ref?.start },
        schema: historySchema,
        signal,
      }),
    enabled: ref !== null,
  });
}

/** What made a version, in words. */
export const causeWords: Record<string, string> = {
  initial: 'first computed',
  'late-readings': 'late readings arrived',
  'configuration-version': 'configuration version',
  correction: 'correction',
  reopen: 'period reopened',
  scheduled: 'scheduled recompute',
};

export interface ComparisonRow {
  key: 'mass' | 'standardVolume' | 'energy';
  label: string;
  first: string;
  current: string;
  difference: string;
  /** The difference as a percentage of the first figure; "—" when the first is zero or missing. */
  percent: string;
}

const signed = (text: string, value: number) => (value > 0 ? `+${text}` : text);

/**
 * @param history the record's versions, first, current and difference (SI)
 * @param set the site's display units
 * @returns one row per quantity: first, current, current − first and that as a percentage of the first
 */
export function compareFirstAndCurrent(history: RecordHistory, set: DisplayUnitSet): ComparisonRow[] {
  const row = (
    key: ComparisonRow['key'],
    label: string,
    unit: string,
    first: number | null,
    current: number | null,
  ): ComparisonRow => {
    if (first === null || current === null)
      return { key, label, first: '—', current: '—', difference: '—', percent: '—' };
    const a = fromSI(first, unit);
    const b = fromSI(current, unit);
    return {
      key,
      label,
      // Six figures: two versions often differ in the fifth, which four would hide.
      first: formatNumber(a, 6),
      current: formatNumber(b, 6),
      difference: signed(formatNumber(b - a), b - a),
      percent: first === 0 ? '—' : `${signed(formatNumber(((current - first) / first) * 100, 3), current - first)} %`,
    };
  };
  const { first, current } = history;
  return [
    row('mass', `Mass, ${set.mass.label}`, set.mass.unit, first.massKg, current.massKg),
    row(
      'standardVolume',
      `Volume at base, ${set.standardVolume.label}`,
      set.standardVolume.unit,
      first.standardVolumeM3,
      current.standardVolumeM3,
    ),
    row('energy', `Energy, ${set.energy.label}`, set.energy.unit, first.energyJ, current.energyJ),
  ];
}
