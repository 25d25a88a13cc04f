/**
 * What a meter run is: its site, primary element, fluid and line, and its transmitters with
 * their ranges, stacked roles and calibration dates. Values in the site's display units.
 */
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { useLatestCalibrations } from '@/components/calibrations/api';
import { AppText } from '@/components/ui/AppText';
import { DataTable, type DataColumn } from '@/components/ui/DataTable';
import { Panel } from '@/components/ui/Panel';
import { colors, fontFamily, space } from '@/constants/theme';
import { formatNumber, formatPlain, unitLabel, unitsFor } from '@/constants/units-display';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import type { Transmitter } from '@/hooks/api/transmitters';
import { fromSI } from '@/shared/units';
import { betaOf, elementName, fluidDetail, fluidName } from './describeMeterRun';
import { calibrationState } from './calibrationState';

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <AppText variant="caption" tone="muted">
        {label}
      </AppText>
      <AppText tabular>{value}</AppText>
    </View>
  );
}

const measuresLabel: Record<Transmitter['measures'], string> = {
  'differential-pressure': 'Differential pressure',
  'static-pressure': 'Static pressure',
  temperature: 'Temperature',
  'flow-direction': 'Flow direction input',
};
/** How a bi-directional meter run knows which way it flows, in words. */
const directionSourceWords: Record<NonNullable<MeterRun['directionSource']>, string> = {
  'dp-sign': 'Sign of the DP',
  'direction-input': 'Direction input',
};
const roleLabel: Record<Transmitter['stackRole'], string> = {
  single: 'single',
  low: 'low range (stacked)',
  high: 'high range (stacked)',
};

/** Line data fields the set-up may hold, in words. */
const lineLabels: Record<string, string> = {
  insideDiameterM: 'Inside diameter',
  nominalSize: 'Nominal size',
  schedule: 'Schedule',
  flangeClass: 'Flange class',
  pipeMaterial: 'Pipe material',
  elementMaterial: 'Element material',
  upstreamStraightLengthD: 'Upstream straight length (D)',
  downstreamStraightLengthD: 'Downstream straight length (D)',
  approvals: 'Approvals',
  installDate: 'Installed',
  expectedServiceLifeYears: 'Expected service life (years)',
  bidirectional: 'Flow in both directions',
};

const transmitterColumns: DataColumn[] = [
  { key: 'tag', title: 'Tag', width: 160 },
  { key: 'measures', title: 'Measures', width: 160, align: 'left' },
  { key: 'range', title: 'Range', width: 220 },
  { key: 'role', title: 'Stacked role', width: 170, align: 'left' },
  { key: 'accuracy', title: 'Accuracy, % of span', width: 110 },
  { key: 'calibration', title: 'Calibration due', width: 240, align: 'left' },
];

interface MeterRunHeaderProps {
  run: MeterRun;
  site: Site | undefined;
  transmitters: readonly Transmitter[];
  /** Today at the site, YYYY-MM-DD, for calibration dates. */
  today: string;
}

export function MeterRunHeader({ run, site, transmitters, today }: MeterRunHeaderProps) {
  const set = unitsFor(site?.displayUnits ?? 'si');
  const length = (m: number | undefined) =>
    m === undefined ? '—' : `${formatNumber(m / set.length.metresPerUnit)} ${set.length.label}`;
  const element = run.element;
  const beta = element ? betaOf(element) : null;
  const reverseElement = run.reverseElement;
  const reverseBeta = reverseElement ? betaOf(reverseElement) : null;
  const lineEntries = Object.entries(run.line).filter(
    ([, value]) => value !== undefined && value !== null && value !== '',
  );

  // The latest calibration in force sets the due date; the transmitter's own date only when none is recorded.
  const latest = useLatestCalibrations(transmitters.map((t) => t.id));
  const rows = transmitters.map((t) => {
    const last = latest[t.id];
    const calibration = calibrationState(last?.nextDue ?? t.calibrationDue, today);
    const pressureSuffix =
      t.measures === 'static-pressure' ? (t.pressureReference === 'gauge' ? ' gauge' : ' abs') : '';
    return {
      key: t.id,
      testID: `transmitter-row-${t.tag}`,
      cells: {
        // The tag opens the transmitter's calibration history.
        tag: (
          <Link href={`/transmitters/${t.id}`} testID={`transmitter-link-${t.tag}`}>
            <AppText variant="label">{t.tag}</AppText>
          </Link>
        ),
        measures: measuresLabel[t.measures],
        range: `${formatPlain(t.lowerRange)} to ${formatPlain(t.upperRange)} ${unitLabel(t.unit)}${pressureSuffix}`,
        role: t.measures === 'differential-pressure' ? roleLabel[t.stackRole] : '—',
        accuracy: `±${formatPlain(t.accuracyPercentOfSpan)}`,
        calibration: (
          <View>
            <AppText
              variant={calibration.abnormal ? 'bodyStrong' : 'body'}
              style={calibration.abnormal ? styles.abnormal : null}
            >
              {calibration.text}
            </AppText>
            {last ? (
              <Link href={`/transmitters/${t.id}`} testID={`transmitter-last-calibration-${t.tag}`}>
                <AppText variant="caption" tone={last.asFoundPass ? 'muted' : 'error'}>
                  {`calibrated ${last.calibratedOn} · as found ${last.asFoundPass ? 'pass' : '⚑ fail'}`}
                </AppText>
              </Link>
            ) : null}
          </View>
        ),
      },
    };
  });

  return (
    <>
      <Panel title={`${run.tag} · ${run.name}`} testID="meter-run-header">
        <View style={styles.facts}>
          <Fact label="Site" value={site ? `${site.code} · ${site.name}` : '…'} />
          {site ? (
            <Fact
              label="Contract day"
              value={`from ${String(site.contractHour).padStart(2, '0')}:00, ${site.timeZone}`}
            />
          ) : null}
          {site ? (
            <Fact
              label="Base conditions"
              value={`${formatNumber(fromSI(site.basePressurePa, set.staticPressure.unit))} ${set.staticPressure.gauge ? 'psia' : set.staticPressure.label}, ${formatNumber(fromSI(site.baseTemperatureK, set.temperature.unit))} ${set.temperature.label}`}
            />
          ) : null}
          <Fact
            label={reverseElement ? 'Primary element (forward)' : 'Primary element'}
            value={element ? elementName(element) : 'not configured'}
          />
          <Fact label="β" value={beta === null ? '—' : beta.toFixed(4)} />
          <Fact label="Pipe D" value={length(element?.pipeDiameterM)} />
          {element?.kind === 'cone' ? (
            <Fact label="Cone dc" value={length(element.coneDiameterM)} />
          ) : (
            <Fact label="Bore d" value={length(element?.boreDiameterM)} />
          )}
          {element?.dischargeCoefficient !== undefined ? (
            <Fact label="C (fixed)" value={String(element.dischargeCoefficient)} />
          ) : null}
          {element?.calibration ? (
            <Fact label="Calibration" value={`${element.calibration.length} points of C against Re_D`} />
          ) : null}
          {reverseElement ? <Fact label="Flow" value="Bi-directional" /> : null}
          {reverseElement ? (
            <Fact label="Direction from" value={directionSourceWords[run.directionSource ?? 'dp-sign']} />
          ) : null}
          {reverseElement ? (
            <Fact
              label="Reverse element"
              value={`${elementName(reverseElement)}, β ${reverseBeta === null ? '—' : reverseBeta.toFixed(4)}${reverseElement.dischargeCoefficient !== undefined ? `, C ${reverseElement.dischargeCoefficient} (fixed)` : ''}${reverseElement.calibration ? `, ${reverseElement.calibration.length} points of C against Re_D` : ''}`}
            />
          ) : null}
          <Fact label="Fluid" value={run.fluid ? fluidName(run.fluid) : '—'} />
          <Fact label="Hold limit · gap limit" value={`${run.holdLimitS} s · ${run.maxGapS} s`} />
        </View>
        {run.fluid ? (
          <AppText variant="caption" tone="muted">
            {`Fluid: ${fluidDetail(run.fluid)}`}
          </AppText>
        ) : null}
        {lineEntries.length > 0 ? (
          <View style={styles.facts}>
            {lineEntries.map(([key, value]) => (
              <Fact
                key={key}
                label={lineLabels[key] ?? key}
                value={
                  key === 'insideDiameterM' && typeof value === 'number'
                    ? length(value)
                    : typeof value === 'boolean'
                      ? value
                        ? 'yes'
                        : 'no'
                      : String(value)
                }
              />
            ))}
          </View>
        ) : null}
      </Panel>
      <Panel title="Transmitters" testID="meter-run-transmitters">
        <DataTable
          columns={transmitterColumns}
          rows={rows}
          label={`Transmitters of ${run.tag}`}
          emptyText="No transmitters yet."
        />
        {transmitters.some((t) => t.stackRole !== 'single') ? (
          <AppText variant="caption" tone="muted">
            {`Stacked pair: the high-range transmitter is used above ${Math.round(run.stackSwitchUpShare * 100)} % of the low-range span and the low-range one again below ${Math.round(run.stackSwitchDownShare * 100)} %.`}
          </AppText>
        ) : null}
      </Panel>
    </>
  );
}

const styles = StyleSheet.create({
  facts: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.xl, rowGap: space.sm },
  fact: { minWidth: 120 },
  abnormal: { color: colors.alarmMedium, fontFamily: fontFamily.semibold },
});
