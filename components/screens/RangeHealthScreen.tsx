/**
 * Range health (engineers and admins): for a meter run and a period (the last 30 days unless
 * chosen), how its flowing time and volume sat in the bands of the active DP span, per DP
 * transmitter of a stacked pair, with each band's part of the uncertainty; the same month by
 * month; and what to change, with the numbers behind it. The figures are the server's
 * (GET /api/meter-runs/:id/range-health), from the hourly records.
 */
import { router } from 'expo-router';
import { useState } from 'react';

import { formatInstant } from '@/shared/format/time';
import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { formatNumber, unitsFor } from '@/constants/units-display';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { useRangeHealth } from '@/hooks/api/rangeHealth';
import { useSites } from '@/hooks/api/sites';
import { fromSI } from '@/shared/units';
import { RangeHealthAdvice } from './RangeHealthAdvice';
import { RangeHealthBands } from './RangeHealthBands';
import { lastDays, RangeHealthPicker, type Period } from './RangeHealthPicker';
import { RangeHealthTransmitters } from './RangeHealthTransmitters';
import { RangeHealthTrend } from './RangeHealthTrend';

/** The default period (the issue: last 30 days). */
const defaultDays = 30;

export function RangeHealthScreen({ meterRunId: initialMeterRunId }: { meterRunId?: string }) {
  const sites = useSites();
  const meterRuns = useMeterRuns();
  const [meterRunId, setMeterRunId] = useState<string | null>(
    initialMeterRunId && /^\d+$/.test(initialMeterRunId) ? initialMeterRunId : null,
  );
  const [period, setPeriod] = useState<Period>(() => lastDays(defaultDays, Date.now()));
  const [limitPercent, setLimitPercent] = useState('1');
  const report = useRangeHealth(
    meterRunId ? { meterRunId, from: period.from, to: period.to, uncertaintyLimitPercent: Number(limitPercent) } : null,
  );

  const run = meterRuns.data?.find((r) => r.id === meterRunId);
  const site = sites.data?.find((s) => s.id === run?.siteId);
  const set = unitsFor(site?.displayUnits ?? 'si');
  const zone = site?.timeZone ?? 'UTC';
  const data = report.data && report.data.meterRunId === meterRunId ? report.data : undefined;

  const pick = (id: string | null) => {
    setMeterRunId(id);
    router.setParams({ meterRunId: id ?? undefined });
  };

  return (
    <Screen
      lead="How a meter run's flow sat in the span of its DP transmitters: the share of flowing time and of volume in each band, per transmitter of a stacked pair, what each band adds to the uncertainty, the trend month by month, and what to change."
      testID="range-health-screen"
    >
      <QueryState
        isPending={meterRuns.isPending || sites.isPending}
        error={meterRuns.error ?? sites.error}
        onRetry={() => void meterRuns.refetch()}
        noun="meter runs"
      />
      {meterRuns.data && sites.data ? (
        <RangeHealthPicker
          sites={sites.data}
          meterRuns={meterRuns.data}
          meterRunId={meterRunId}
          onMeterRun={pick}
          period={period}
          onPeriod={setPeriod}
          limitPercent={limitPercent}
          onLimit={setLimitPercent}
        />
      ) : null}
      {!meterRunId ? <AppText tone="muted">Choose a meter run for its report.</AppText> : null}
      {meterRunId ? (
        <QueryState
          isPending={report.isPending}
          error={report.error}
          onRetry={() => void report.refetch()}
          noun="the range health report"
        />
      ) : null}
      {data && site ? (
        <>
          <AppText testID="range-health-summary">
            {`${run?.tag ?? ''} from ${formatInstant(data.from, zone)} to ${formatInstant(data.to, zone)}: ${data.hours} hourly records, ${formatNumber(data.flowTimeS / 3600, 4)} h of flow, ${formatNumber(fromSI(data.standardVolumeM3, set.standardVolume.unit))} ${set.standardVolume.label} at base conditions${data.uncertaintyPercent === null ? '' : `, U ±${formatNumber(data.uncertaintyPercent, 3)} % (k = 2)`}.`}
          </AppText>
          <AppText variant="caption" tone="muted" testID="range-health-scope">
            This report looks at the flow the meter run actually saw: U is the hourly records' uncertainty weighted by
            mass, and the recommendation runs the range check at the period's lowest, typical and highest hourly flow
            with the same budget. The range check screen looks at a design range you type; at the same flow both give
            the same uncertainty.
          </AppText>
          {data.flowTimeS > 0 ? (
            <>
              <RangeHealthBands report={data} set={set} />
              <RangeHealthTransmitters report={data} />
              <RangeHealthTrend report={data} timeZone={zone} />
            </>
          ) : (
            <Notice title="No flow in this period" testID="range-health-no-flow">
              The hourly records of this period have no flowing time, so there are no shares to show. Choose a longer
              period, or check that readings arrive.
            </Notice>
          )}
          <RangeHealthAdvice report={data} set={set} displayUnits={site.displayUnits} />
        </>
      ) : null}
    </Screen>
  );
}
