/**
 * The audit log (engineer, accountant, admin, read only): the newest changes, newest first,
 * filtered by meter run, user, kind and period, and exported as CSV (the export is itself audited).
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { space } from '@/constants/theme';
import { defaultAuditLimit, useAuditActors, useAuditEvents, useExportAuditCsv } from '@/hooks/api/auditEvents';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { useSites } from '@/hooks/api/sites';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { AuditEventRow } from './audit/AuditEventRow';
import { AuditFilters, type AuditScreenFilters } from './audit/AuditFilters';
import { periodWindow, type PeriodChoice } from './audit/auditFilterParams';

export function AuditLogScreen() {
  const phone = useBreakpoint() === 'phone';
  const [filters, setFilters] = useState<AuditScreenFilters>({});
  const [period, setPeriod] = useState<PeriodChoice>({ preset: 'all' });
  // A preset's window is fixed when it is chosen, so the query (and its cache key) holds still.
  const [nowMs, setNowMs] = useState(() => Date.now());
  const span = periodWindow(period, nowMs);
  const query = { ...filters, from: span.from, to: span.to };
  const events = useAuditEvents(defaultAuditLimit, query, !span.error);
  const actors = useAuditActors();
  const sites = useSites();
  const meterRuns = useMeterRuns();
  const exportCsv = useExportAuditCsv();
  const list = events.data ?? [];
  // The API names each actor beside the e-mail; the sentence says the name.
  const names = new Map(
    list.flatMap((e) => (e.actorEmail && e.actorName ? [[e.actorEmail, e.actorName] as const] : [])),
  );
  const nameOf = (email: string) => names.get(email);

  return (
    <Screen lead="Every change to set-up, readings, corrections, periods and users, with who made it and when: the trail to show an auditor. Read only.">
      <AuditFilters
        filters={filters}
        period={period}
        periodError={span.error}
        sites={sites.data ?? []}
        meterRuns={meterRuns.data ?? []}
        actors={actors.data ?? []}
        onChange={setFilters}
        onPeriodChange={(next) => {
          setNowMs(Date.now());
          setPeriod(next);
        }}
        folded={phone}
      />
      <Panel
        title={
          events.data ? `Latest events (${list.length}${list.length >= defaultAuditLimit ? '+' : ''})` : 'Latest events'
        }
        actions={
          <View style={styles.actions}>
            <Button
              label="Export CSV"
              size="compact"
              variant="secondary"
              busy={exportCsv.isPending}
              disabled={Boolean(span.error)}
              onPress={() => exportCsv.mutate(query)}
              testID="audit-export-csv"
            />
            <Button
              label="Refresh"
              size="compact"
              busy={events.isFetching && !events.isPending}
              onPress={() => {
                setNowMs(Date.now());
                void events.refetch();
              }}
            />
          </View>
        }
        testID="audit-list"
      >
        {exportCsv.error ? (
          <AppText tone="error" testID="audit-export-error">
            {exportCsv.error.message}
          </AppText>
        ) : null}
        {span.error ? null : (
          <QueryState
            isPending={events.isPending}
            error={events.error}
            onRetry={() => void events.refetch()}
            noun="the audit log"
          />
        )}
        {events.data && list.length === 0 ? (
          <AppText tone="muted" testID="audit-empty">
            Nothing recorded matches these filters.
          </AppText>
        ) : null}
        {list.map((event) => (
          <AuditEventRow key={event.id} event={event} nameOf={nameOf} />
        ))}
        {list.length >= defaultAuditLimit ? (
          <AppText variant="caption" tone="muted">
            {`The newest ${defaultAuditLimit} are shown; narrow the filters, or export CSV for every matching event.`}
          </AppText>
        ) : null}
      </Panel>
    </Screen>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
});
