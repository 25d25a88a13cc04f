import type { PeriodView } from './use-cases';

const iso = (ms: number) => new Date(ms).toISOString();

/**
 * A site's contract month: `status`, `closedAt`, `closedBy` (null while open), `pending` (hours
 * held per meter run, imports by id) and `incomplete` (what is not final). Instants ISO, ids strings.
 */
export function presentPeriod(view: PeriodView) {
  const heldByRun = new Map<string, { meterRunId: string; tag: string; hours: number; starts: string[] }>();
  for (const h of view.pending.hours) {
    const entry = heldByRun.get(h.meterRunId) ?? { meterRunId: h.meterRunId, tag: h.tag, hours: 0, starts: [] };
    entry.hours += 1;
    entry.starts.push(iso(h.startMs));
    heldByRun.set(h.meterRunId, entry);
  }
  return {
    siteId: view.site.id,
    month: view.month,
    start: iso(view.startMs),
    end: iso(view.endMs),
    status: view.status,
    closedAt: view.closed ? view.closed.actedAt.toISOString() : null,
    closedBy: view.closed ? { id: view.closed.actedBy.id, email: view.closed.actedBy.email } : null,
    pending: {
      hours: [...heldByRun.values()],
      imports: view.pending.imports.map((i) => ({
        id: i.id,
        kind: i.kind,
        filename: i.filename,
        createdAt: i.createdAt.toISOString(),
      })),
    },
    incomplete: {
      final: !view.incomplete.hours.length && !view.incomplete.corrections.length && !view.incomplete.alarms.length,
      hours: view.incomplete.hours,
      corrections: view.incomplete.corrections.map((c) => ({
        id: c.id,
        meterRunId: c.meterRunId,
        start: iso(c.startMs),
        end: iso(c.endMs),
      })),
      alarms: view.incomplete.alarms,
    },
  };
}
