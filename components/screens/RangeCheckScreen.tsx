/**
 * Range check (engineers and admins): will a meter run's DP transmitters measure its flow range
 * within an uncertainty limit, where does each fall below 10 % of its span, and what low-range
 * span would close the gap. Computed in the browser with the shared flow engine
 * (shared/flow rangeCheck), from a meter run's set-up or a case typed in.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';

import {
  runRangeCheck,
  type Problems,
  type RangeCheckField,
  type RangeCheckRun,
} from '@/components/meter-runs/rangeCheckInput';
import {
  defaultValues,
  prefillFromMeterRun,
  prefillOperatingPoint,
  switchUnits,
  type RangeCheckValues,
} from '@/components/meter-runs/rangeCheckValues';
import { recordedOperatingPoint } from '@/components/meter-runs/recordedOperatingPoint';
import { Notice } from '@/components/ui/Notice';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { convertFlowRate, flowRateUnit, type DisplayUnits } from '@/constants/units-display';
import { useMeterRuns } from '@/hooks/api/meterRuns';
import { useSites } from '@/hooks/api/sites';
import { hourlyRecordsQuery } from '@/hooks/api/totals';
import { useTransmitters } from '@/hooks/api/transmitters';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { RangeCheckForm } from './RangeCheckScreenForm';
import { RangeCheckResults } from './RangeCheckScreenResults';

/** How far back a picked meter run's hourly records are read for its operating point. */
const recordedDays = 30;

export function RangeCheckScreen() {
  const wide = useBreakpoint() === 'wide';
  const meterRuns = useMeterRuns();
  const sites = useSites();
  const transmitters = useTransmitters();
  const [values, setValues] = useState<RangeCheckValues>(() => defaultValues('si'));
  const [problems, setProblems] = useState<Problems>({});
  const [run, setRun] = useState<RangeCheckRun | null>(null);
  // The answer belongs to the values it was computed from; an edit marks it out of date.
  const [stale, setStale] = useState(false);
  const [prefillNote, setPrefillNote] = useState<string | null>(null);
  const queryClient = useQueryClient();

  const edit = (change: Partial<RangeCheckValues>, field?: RangeCheckField) => {
    setValues((current) => ({ ...current, ...change }));
    if (field) setProblems((current) => ({ ...current, [field]: undefined, form: undefined }));
    setStale(true);
  };

  const submit = () => {
    const answer = runRangeCheck(values);
    setProblems(answer.problems);
    setRun(answer.run);
    setStale(false);
  };

  const changeUnits = (units: DisplayUnits) => {
    setValues((current) => switchUnits(current, units));
    setProblems({});
    setStale(true);
  };

  /** Flows follow a new unit; between mass and volume that needs the last answer's base density, else they stay as typed. */
  const changeFlowUnit = (key: string) => {
    setValues((current) => {
      const from = flowRateUnit(current.flowUnitKey);
      const to = flowRateUnit(key);
      const density = run?.baseDensityKgPerM3 ?? null;
      const convert = (text: string) => {
        const value = Number(text);
        if (text.trim() === '' || !Number.isFinite(value)) return text;
        const converted = convertFlowRate(value, from, to, density);
        return converted === null ? text : String(Number(converted.toPrecision(6)));
      };
      return {
        ...current,
        flowUnitKey: key,
        minimumFlow: convert(current.minimumFlow),
        normalFlow: convert(current.normalFlow),
        maximumFlow: convert(current.maximumFlow),
      };
    });
    setStale(true);
  };

  const pickMeterRun = (meterRunId: string | null) => {
    if (meterRunId === null) {
      setValues((current) => ({ ...current, meterRunId: null }));
      setPrefillNote(null);
      return;
    }
    const meterRun = meterRuns.data?.find((r) => r.id === meterRunId);
    const site = meterRun ? sites.data?.find((s) => s.id === meterRun.siteId) : undefined;
    if (!meterRun || !site) return;
    const prefilled = prefillFromMeterRun(
      values,
      meterRun,
      site,
      (transmitters.data ?? []).filter((t) => t.meterRunId === meterRunId),
    );
    setValues(prefilled);
    setProblems({});
    setStale(true);
    setPrefillNote(
      `Filled in from ${meterRun.tag}: element, fluid, site conditions and DP transmitters. Looking for its recorded operating point…`,
    );
    // The operating point from the last 30 days of hourly records, when there are any.
    const to = new Date();
    const from = new Date(to.getTime() - recordedDays * 86_400_000);
    queryClient
      .fetchQuery(hourlyRecordsQuery(meterRunId, from.toISOString(), to.toISOString()))
      .then((records) => {
        const point = recordedOperatingPoint(records);
        if (!point) {
          setPrefillNote(
            `Filled in from ${meterRun.tag}: element, fluid, site conditions and DP transmitters. It has no flowing hours in the last ${recordedDays} days: enter its operating pressure, temperature and flow range.`,
          );
          return;
        }
        setValues((current) => (current.meterRunId === meterRunId ? prefillOperatingPoint(current, point) : current));
        setPrefillNote(
          `Filled in from ${meterRun.tag}: element, fluid, site conditions and DP transmitters; pressure, temperature and the flow range (lowest, median and highest flowing rate) from ${point.hours} recorded hours of the last ${recordedDays} days. Adjust them to the range you plan for.`,
        );
      })
      .catch((error: Error) =>
        setPrefillNote(
          `Filled in from ${meterRun.tag}, but its hourly records could not be read (${error.message}): enter its operating point.`,
        ),
      );
  };

  return (
    <Screen
      lead="Will the DP transmitters measure this meter run's flow range within the uncertainty limit? See where each falls below 10 % of its span, the turndown it covers, and the low-range span that would close a gap. Start from a meter run or type a case."
      testID="range-check-screen"
    >
      <Notice title="Caution">
        This tool supports, and does not replace, licensed measurement practice and the standards that apply to your
        meter. Re-ranging or adding a transmitter means working on pressurised lines: follow your site procedures, local
        codes and the equipment maker's instructions.
      </Notice>
      <QueryState
        isPending={meterRuns.isPending}
        error={meterRuns.error}
        onRetry={() => void meterRuns.refetch()}
        noun="meter runs"
      />
      {prefillNote ? <Notice testID="range-check-prefill">{prefillNote}</Notice> : null}
      <RangeCheckForm
        values={values}
        problems={problems}
        meterRuns={meterRuns.data ?? []}
        onEdit={edit}
        onUnits={changeUnits}
        onFlowUnit={changeFlowUnit}
        onPickMeterRun={pickMeterRun}
        onSubmit={submit}
        wide={wide}
      />
      {run ? (
        <>
          {stale ? (
            <Notice testID="range-check-stale">
              The case has changed since this answer: check the range again to update it.
            </Notice>
          ) : null}
          <RangeCheckResults run={run} displayUnits={values.displayUnits} />
        </>
      ) : null}
    </Screen>
  );
}
