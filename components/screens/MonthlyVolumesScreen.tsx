/**
 * Monthly volumes (issue 10), the accountant's home: pick a site and a contract month; a card per
 * meter run on a phone, one table on a wider screen; the site's total; the month's close; the
 * exports (CSV, Excel, a printable statement); a drill-down to contract days, then hours; the
 * station balance of the site's groups (the month and its contract days) and the reconciliation
 * of a chosen meter run against its field totals.
 */
import { useQueries } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';

import { BalancePanel } from '@/components/balance/BalancePanel';
import { AllocationPanel } from '@/components/month-end/AllocationPanel';
import { MeterRunMonthCard } from '@/components/month-end/MeterRunMonthCard';
import { MonthClosePanel } from '@/components/month-end/MonthClosePanel';
import { MonthDrillDown } from '@/components/month-end/MonthDrillDown';
import { MonthlyVolumesTable } from '@/components/month-end/MonthlyVolumesTable';
import { lastMonth, shiftMonth } from '@/components/month-end/monthFormat';
import { ReconciliationPanel } from '@/components/reconciliation/ReconciliationPanel';
import { reconciliationKeys, reconciliationSumSchema } from '@/components/reconciliation/useReconciliations';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { can } from '@/constants/roles';
import { space } from '@/constants/theme';
import { formatNumber } from '@/constants/units-display';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { apiRequest } from '@/hooks/api/client';
import {
  useExportMonthlyVolumes,
  useMonthlyVolumes,
  useOpenStatement,
  type MonthlyVolumes,
} from '@/hooks/api/monthlyVolumes';
import { useSites } from '@/hooks/api/sites';
import { useSignedInUser } from '@/hooks/session/SessionProvider';
import { fromSI } from '@/shared/units';

/** Base conditions in the site's units, as the figures are stated at them. */
function baseConditions(site: MonthlyVolumes['site']): string {
  return site.displayUnits === 'us'
    ? `${formatNumber(fromSI(site.basePressurePa, 'psi'), 5)} psia, ${formatNumber(fromSI(site.baseTemperatureK, 'degF'), 4)} °F`
    : `${formatNumber(fromSI(site.basePressurePa, 'kPa'), 6)} kPa abs, ${formatNumber(fromSI(site.baseTemperatureK, 'degC'), 4)} °C`;
}

/**
 * The month's reconciliation for a meter run picked here; by default the first with field totals
 * in the month (each run's month sum is asked for, the same query the panel then reads).
 */
function MonthReconciliation({ volumes }: { volumes: MonthlyVolumes }) {
  const [chosen, setChosen] = useState<string | null>(null);
  const { start: from, end: to } = volumes;
  const sums = useQueries({
    queries: volumes.meterRuns.map((r) => {
      const request = { meterRunId: r.meterRunId, from, to };
      return {
        queryKey: reconciliationKeys.summary(request),
        queryFn: ({ signal }: { signal: AbortSignal }) =>
          apiRequest({
            path: '/reconciliations/summary',
            query: { ...request },
            schema: z.array(reconciliationSumSchema),
            signal,
          }),
      };
    }),
  });
  const withFieldTotals = volumes.meterRuns.find((r, i) => sums[i]?.data?.some((s) => s.days > 0));
  const meterRunId = chosen ?? withFieldTotals?.meterRunId ?? volumes.meterRuns[0]?.meterRunId;
  if (!meterRunId) return null;
  return (
    <View style={styles.section}>
      <ChoiceGroup
        label="Meter run to reconcile"
        options={volumes.meterRuns.map((r) => ({ value: r.meterRunId, label: r.tag }))}
        value={meterRunId}
        onChange={setChosen}
        testIDPrefix="monthly-reconcile-run"
      />
      <ReconciliationPanel
        key={meterRunId}
        meterRunId={meterRunId}
        timeZone={volumes.site.timeZone}
        from={from}
        to={to}
        title={`Reconciliation against field totals, ${volumes.meterRuns.find((r) => r.meterRunId === meterRunId)?.tag ?? ''}`}
        testID="monthly-reconciliation"
      />
    </View>
  );
}

/**
 * @param siteExtra drawn below the site and month choice, for the chosen site (the Totals tab puts
 *   each meter run's latest contract days there)
 */
export function MonthlyVolumesScreen({ siteExtra }: { siteExtra?: (siteId: string) => ReactNode } = {}) {
  const user = useSignedInUser();
  const breakpoint = useBreakpoint();
  const sites = useSites();
  const [chosenSiteId, setSiteId] = useState<string | undefined>(undefined);
  const [month, setMonth] = useState(() => lastMonth(Date.now()));
  const [drill, setDrill] = useState<string | null>(null);
  // The daily balance is long: folded on a phone until asked for, open on a wider screen.
  const [dailyBalanceOpen, setDailyBalanceOpen] = useState<boolean | null>(null);
  const siteId = chosenSiteId ?? sites.data?.[0]?.id;
  const volumes = useMonthlyVolumes(siteId, month);
  const exportFile = useExportMonthlyVolumes();
  const statement = useOpenStatement();
  const v = volumes.data;
  const drillRun = v?.meterRuns.find((r) => r.meterRunId === drill);
  const mayExport = can(user.role, 'exportVolumes');
  const showDailyBalance = dailyBalanceOpen ?? breakpoint !== 'phone';

  return (
    <Screen
      testID="screen-monthly-volumes"
      lead="Last month's volumes per meter run and for the site, at the site's base conditions, with their coverage, uncertainty and status; close the month and export it for billing."
    >
      <Panel title="Site and month">
        <QueryState isPending={sites.isPending} error={sites.error} onRetry={() => void sites.refetch()} noun="sites" />
        {sites.data?.length ? (
          <ChoiceGroup
            label="Site"
            options={sites.data.map((s) => ({ value: s.id, label: s.code }))}
            value={siteId ?? ''}
            onChange={(id) => {
              setSiteId(id);
              setDrill(null);
            }}
            testIDPrefix="monthly-site"
          />
        ) : null}
        <View style={styles.monthRow}>
          <Button
            label="◂ Earlier"
            size="compact"
            onPress={() => {
              setMonth((m) => shiftMonth(m, -1));
              setDrill(null);
            }}
            testID="monthly-month-earlier"
          />
          <AppText variant="title" testID="monthly-month" accessibilityLabel={`Contract month ${month}`}>
            {month}
          </AppText>
          <Button
            label="Later ▸"
            size="compact"
            onPress={() => {
              setMonth((m) => shiftMonth(m, 1));
              setDrill(null);
            }}
            testID="monthly-month-later"
          />
        </View>
      </Panel>
      {siteId && siteExtra ? siteExtra(siteId) : null}

      <QueryState
        isPending={volumes.isPending && siteId !== undefined}
        error={volumes.error}
        onRetry={() => void volumes.refetch()}
        noun="monthly volumes"
      />

      {v ? (
        <>
          <AppText testID="monthly-summary">
            {`${v.site.code} ${v.site.name} · ${v.month} · status ${v.status} · at ${baseConditions(v.site)} · contract day from ${String(v.site.contractHour).padStart(2, '0')}:00 ${v.site.timeZone}`}
          </AppText>
          {breakpoint === 'phone' ? (
            <View style={styles.cards}>
              {v.meterRuns.map((r, index) => (
                <MeterRunMonthCard
                  key={r.meterRunId}
                  title={`${r.tag} · ${r.name}`}
                  figures={r}
                  displayUnits={v.site.displayUnits}
                  onOpenDays={() => setDrill(r.meterRunId)}
                  testID={`monthly-card-${index}`}
                />
              ))}
              <MeterRunMonthCard
                title={`Site total · ${v.site.code}`}
                figures={v.totals}
                displayUnits={v.site.displayUnits}
                testID="monthly-card-total"
              />
            </View>
          ) : (
            <Panel title="Meter runs and site total">
              <MonthlyVolumesTable volumes={v} onOpenDays={setDrill} />
            </Panel>
          )}
          {!v.meterRuns.some((r) => r.version !== null) ? (
            <AppText tone="muted" testID="monthly-empty">
              No meter run of this site has a total for this month.
            </AppText>
          ) : null}
          {drillRun ? (
            <MonthDrillDown
              key={drillRun.meterRunId}
              meterRunId={drillRun.meterRunId}
              tag={drillRun.tag}
              from={v.start}
              to={v.end}
              timeZone={v.site.timeZone}
              displayUnits={v.site.displayUnits}
              onClose={() => setDrill(null)}
            />
          ) : null}
          <AppText variant="caption" tone="muted">
            Volume at base conditions is compared with the previous month and the same month a year earlier. U: expanded
            uncertainty (k = 2) of the volume at base conditions; the site's U combines the meter runs as uncorrelated
            (root-sum-square). Coverage of the site is its least covered meter run.
          </AppText>
          <AllocationPanel siteId={v.site.id} month={v.month} displayUnits={v.site.displayUnits} />
          <BalancePanel
            key={`month-${v.site.id}-${v.month}`}
            siteId={v.site.id}
            timeZone={v.site.timeZone}
            displayUnits={v.site.displayUnits}
            interval="month"
            from={v.start}
            to={v.end}
            title={`Station balance, ${v.month}`}
            testID="monthly-balance"
          />
          <View style={styles.section}>
            <View style={styles.buttons}>
              <Button
                label={showDailyBalance ? 'Hide the balance per contract day' : 'Show the balance per contract day'}
                size="compact"
                onPress={() => setDailyBalanceOpen(!showDailyBalance)}
                testID="monthly-balance-days-toggle"
              />
            </View>
            {showDailyBalance ? (
              <BalancePanel
                key={`days-${v.site.id}-${v.month}`}
                siteId={v.site.id}
                timeZone={v.site.timeZone}
                displayUnits={v.site.displayUnits}
                interval="day"
                from={v.start}
                to={v.end}
                title="Station balance per contract day"
                testID="monthly-balance-days"
              />
            ) : null}
          </View>
          <MonthReconciliation key={`${v.site.id}-${v.month}`} volumes={v} />
          <MonthClosePanel
            siteId={v.site.id}
            month={v.month}
            canClose={can(user.role, 'closePeriod')}
            timeZone={v.site.timeZone}
          />
          <Panel title="Export" testID="monthly-export">
            {mayExport ? (
              <View style={styles.buttons}>
                {(['csv', 'xlsx'] as const).map((format) => (
                  <Button
                    key={format}
                    label={format === 'csv' ? 'Download CSV' : 'Download Excel'}
                    busy={exportFile.isPending && exportFile.variables?.format === format}
                    onPress={() => exportFile.mutate({ siteId: v.site.id, siteCode: v.site.code, month, format })}
                    testID={`monthly-export-${format}`}
                  />
                ))}
                <Button
                  label="Printable statement"
                  busy={statement.isPending}
                  onPress={() => statement.mutate({ siteId: v.site.id, month })}
                  testID="monthly-statement"
                />
              </View>
            ) : (
              <AppText tone="muted">Exporting volumes is for engineers, accountants and administrators.</AppText>
            )}
            {exportFile.error || statement.error ? (
              <AppText tone="error" testID="monthly-export-error">
                {(exportFile.error ?? statement.error)?.message}
              </AppText>
            ) : null}
            <AppText variant="caption" tone="muted">
              Every export is recorded in the audit trail with who took it and when.
            </AppText>
          </Panel>
        </>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  monthRow: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  cards: { gap: space.md },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  section: { gap: space.sm, alignItems: 'stretch' },
});
