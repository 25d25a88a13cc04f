/**
 * The range check form: a meter run to start from (optional), units, primary element, fluid,
 * operating conditions, flow range, one or two DP transmitters and the uncertainty limit. Each
 * problem is named under its field.
 */
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Panel } from '@/components/ui/Panel';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { flowRateUnits, formatNumber, unitsFor, type DisplayUnits } from '@/constants/units-display';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { RangeCheckField, Problems } from '@/components/meter-runs/rangeCheckInput';
import type { RangeCheckValues, TransmitterValues } from '@/components/meter-runs/rangeCheckValues';
import { densityLabel, expansionLabel } from '@/components/meter-runs/rangeCheckUnits';
import { fromSI } from '@/shared/units';

const unitOptions = [
  { value: 'si' as const, label: 'SI' },
  { value: 'us' as const, label: 'US customary' },
];
const elementOptions = [
  { value: 'orifice' as const, label: 'Orifice' },
  { value: 'venturi' as const, label: 'Venturi' },
  { value: 'nozzle' as const, label: 'Nozzle' },
  { value: 'cone' as const, label: 'Cone' },
];
const tapOptions = [
  { value: 'flange' as const, label: 'Flange taps' },
  { value: 'corner' as const, label: 'Corner taps' },
  { value: 'D-D/2' as const, label: 'D and D/2' },
];
const methodOptions = [
  { value: 'iso-5167-2' as const, label: 'ISO 5167-2:2003' },
  { value: 'api-14.3' as const, label: 'API MPMS 14.3 (flange taps)' },
];
const expansionReferenceOptions = [
  { value: 'upstream' as const, label: 'Upstream tap (Y1)' },
  { value: 'downstream' as const, label: 'Downstream tap (Y2)' },
];
const methodNames = { 'iso-5167-2': 'ISO 5167-2:2003', 'api-14.3': 'API MPMS 14.3' } as const;
const venturiOptions = [
  { value: 'as-cast' as const, label: 'As-cast' },
  { value: 'machined' as const, label: 'Machined' },
  { value: 'rough-welded' as const, label: 'Rough-welded' },
];
const nozzleOptions = [
  { value: 'isa-1932' as const, label: 'ISA 1932' },
  { value: 'long-radius' as const, label: 'Long-radius' },
];
const fluidOptions = [
  { value: 'natural-gas' as const, label: 'Natural gas' },
  { value: 'ideal-gas' as const, label: 'Other gas' },
  { value: 'water' as const, label: 'Water' },
  { value: 'steam' as const, label: 'Steam' },
  { value: 'liquid' as const, label: 'Other liquid' },
];
const flowUnitOptions = flowRateUnits.map((unit) => ({ value: unit.key, label: unit.label }));

interface RangeCheckFormProps {
  values: RangeCheckValues;
  problems: Problems;
  meterRuns: readonly MeterRun[];
  onEdit: (change: Partial<RangeCheckValues>, field?: RangeCheckField) => void;
  onUnits: (units: DisplayUnits) => void;
  onFlowUnit: (key: string) => void;
  onPickMeterRun: (meterRunId: string | null) => void;
  onSubmit: () => void;
  /** Lay the sections side by side (wide screens). */
  wide: boolean;
}

function Section({
  title,
  children,
  wide,
  testID,
}: {
  title: string;
  children: ReactNode;
  wide: boolean;
  testID?: string;
}) {
  return (
    <Panel title={title} style={wide ? styles.sectionWide : null} testID={testID}>
      {children}
    </Panel>
  );
}

export function RangeCheckForm({
  values,
  problems,
  meterRuns,
  onEdit,
  onUnits,
  onFlowUnit,
  onPickMeterRun,
  onSubmit,
  wide,
}: RangeCheckFormProps) {
  const set = unitsFor(values.displayUnits);
  const text = (
    field: Exclude<RangeCheckField, `span${number}` | `accuracy${number}` | 'form' | 'elementKind'>,
    label: string,
    hint?: string,
  ) => (
    <TextField
      label={label}
      hint={hint}
      value={values[field as keyof RangeCheckValues] as string}
      onChangeText={(value) => onEdit({ [field]: value } as Partial<RangeCheckValues>, field)}
      error={problems[field]}
      testID={`range-check-${field}`}
      inputMode="decimal"
      autoCapitalize="none"
      autoCorrect={false}
      onSubmitEditing={onSubmit}
    />
  );
  const editTransmitter = (index: number, change: Partial<TransmitterValues>, field: RangeCheckField) =>
    onEdit({ transmitters: values.transmitters.map((t, i) => (i === index ? { ...t, ...change } : t)) }, field);
  const runOptions = [{ value: '', label: 'None' }, ...meterRuns.map((run) => ({ value: run.id, label: run.tag }))];
  const extras = Object.keys(values.elementExtras);
  const pickedRun = meterRuns.find((run) => run.id === values.meterRunId);
  const runMethod = pickedRun?.element?.kind === 'orifice' ? (pickedRun.element.method ?? 'iso-5167-2') : null;

  return (
    <View style={[styles.sections, wide && styles.sectionsWide]}>
      <Section title="Start from" wide={wide} testID="range-check-start">
        {meterRuns.length > 0 ? (
          <ChoiceGroup
            label="Meter run (fills in element, fluid, site and DP transmitters)"
            options={runOptions}
            value={values.meterRunId ?? ''}
            onChange={(id) => onPickMeterRun(id === '' ? null : id)}
            testIDPrefix="range-check-meter-run"
          />
        ) : (
          <AppText tone="muted">No meter runs yet: enter the case by hand.</AppText>
        )}
        <ChoiceGroup
          label="Units"
          options={unitOptions}
          value={values.displayUnits}
          onChange={onUnits}
          testIDPrefix="range-check-units"
        />
      </Section>

      <Section title="Primary element" wide={wide}>
        <ChoiceGroup
          label="Kind"
          options={elementOptions}
          value={values.elementKind}
          onChange={(kind) => onEdit({ elementKind: kind, elementExtras: {} }, 'elementKind')}
          testIDPrefix="range-check-element"
        />
        {values.elementKind === 'orifice' ? (
          <ChoiceGroup
            label="Pressure taps"
            options={tapOptions}
            value={values.taps}
            onChange={(taps) => onEdit({ taps }, 'elementKind')}
            testIDPrefix="range-check-taps"
          />
        ) : null}
        {values.elementKind === 'orifice' ? (
          <ChoiceGroup
            label="Method"
            options={methodOptions}
            value={values.orificeMethod}
            // API MPMS 14.3 Part 1 covers flange taps only, so choosing it sets them.
            onChange={(orificeMethod) =>
              onEdit(
                orificeMethod === 'api-14.3' ? { orificeMethod, taps: 'flange' } : { orificeMethod },
                'elementKind',
              )
            }
            testIDPrefix="range-check-method"
          />
        ) : null}
        {values.elementKind === 'orifice' && values.orificeMethod === 'api-14.3' ? (
          <ChoiceGroup
            label="Static pressure measured at"
            options={expansionReferenceOptions}
            value={values.expansionReference}
            onChange={(expansionReference) => onEdit({ expansionReference }, 'elementKind')}
            testIDPrefix="range-check-expansion-reference"
          />
        ) : null}
        {values.elementKind === 'orifice' && runMethod && pickedRun ? (
          <AppText variant="caption" tone="muted" testID="range-check-run-method">
            {runMethod === values.orificeMethod
              ? `${pickedRun.tag} uses ${methodNames[runMethod]}.`
              : `${pickedRun.tag} uses ${methodNames[runMethod]}; this what-if uses ${methodNames[values.orificeMethod]}.`}
          </AppText>
        ) : null}
        {values.elementKind === 'venturi' ? (
          <ChoiceGroup
            label="Convergent"
            options={venturiOptions}
            value={values.venturiType}
            onChange={(venturiType) => onEdit({ venturiType }, 'elementKind')}
            testIDPrefix="range-check-venturi"
          />
        ) : null}
        {values.elementKind === 'nozzle' ? (
          <ChoiceGroup
            label="Nozzle"
            options={nozzleOptions}
            value={values.nozzleType}
            onChange={(nozzleType) => onEdit({ nozzleType }, 'elementKind')}
            testIDPrefix="range-check-nozzle"
          />
        ) : null}
        {problems.elementKind ? (
          <AppText
            variant="caption"
            tone="error"
            testID="range-check-elementKind-error"
          >{`⊗ ${problems.elementKind}`}</AppText>
        ) : null}
        {text('pipeDiameter', `Pipe inside diameter D, ${set.length.label}`)}
        {values.elementKind === 'cone'
          ? text('coneDiameter', `Cone diameter dc, ${set.length.label}`)
          : text('boreDiameter', `Bore (throat) diameter d, ${set.length.label}`)}
        {text(
          'dischargeCoefficient',
          'Discharge coefficient C (optional)',
          values.elementKind === 'cone'
            ? 'Blank: the calibration curve if there is one, else 0.82 (uncalibrated).'
            : 'Blank: the standard’s C for this element.',
        )}
        {extras.length > 0 ? (
          <AppText variant="caption" tone="muted">{`Also kept from the meter run: ${extras.join(', ')}.`}</AppText>
        ) : null}
      </Section>

      <Section title="Fluid" wide={wide}>
        <ChoiceGroup
          label="Fluid"
          options={fluidOptions}
          value={values.fluidKind}
          onChange={(fluidKind) => onEdit({ fluidKind }, 'composition')}
          testIDPrefix="range-check-fluid"
        />
        {values.fluidKind === 'natural-gas' ? (
          <TextField
            label="Composition, mole fractions"
            hint="One component per line. The default is the AGA 8 Gulf Coast example gas."
            value={values.composition}
            onChangeText={(composition) => onEdit({ composition }, 'composition')}
            error={problems.composition}
            testID="range-check-composition"
            multiline
            numberOfLines={6}
            autoCapitalize="none"
            autoCorrect={false}
          />
        ) : null}
        {values.fluidKind === 'ideal-gas' ? (
          <>
            {text('molarMass', 'Molar mass, g/mol', 'Air 28.97.')}
            {text('compressibility', 'Compressibility Z')}
          </>
        ) : null}
        {values.fluidKind === 'liquid' ? (
          <>
            {text('liquidDensity', `Density at the reference temperature, ${densityLabel(values.displayUnits)}`)}
            {text('liquidReferenceTemperature', `Reference temperature, ${set.temperature.label}`)}
            {text('liquidExpansion', `Volumetric expansion, ${expansionLabel(values.displayUnits)}`)}
          </>
        ) : null}
        {values.fluidKind === 'natural-gas' || values.fluidKind === 'ideal-gas' || values.fluidKind === 'steam'
          ? text('isentropicExponent', 'Isentropic exponent κ (optional)', 'Blank: from the fluid’s properties.')
          : null}
        {text('viscosity', 'Viscosity, mPa·s (cP) (optional)', 'Blank: from the fluid’s properties.')}
      </Section>

      <Section title="Operating conditions" wide={wide}>
        {text(
          'staticPressure',
          `Static pressure, ${set.staticPressure.label}`,
          set.staticPressure.gauge
            ? `Gauge, on an atmosphere of ${formatNumber(fromSI(values.atmosphericPressurePa, set.staticPressure.unit))} ${set.staticPressure.unit}a.`
            : `Absolute, at the ${values.elementKind === 'orifice' && values.orificeMethod === 'api-14.3' && values.expansionReference === 'downstream' ? 'downstream' : 'upstream'} tap.`,
        )}
        {text('temperature', `Temperature, ${set.temperature.label}`)}
        <ChoiceGroup
          label="Flow unit"
          options={flowUnitOptions}
          value={values.flowUnitKey}
          onChange={onFlowUnit}
          testIDPrefix="range-check-flow-unit"
        />
        {text('minimumFlow', 'Minimum flow')}
        {text('normalFlow', 'Normal flow')}
        {text('maximumFlow', 'Maximum flow')}
      </Section>

      <Section title="DP transmitters" wide={wide}>
        {values.transmitters.map((t, i) => (
          <View key={i} style={styles.transmitter} testID={`range-check-transmitter-${i}`}>
            <AppText variant="bodyStrong">
              {values.transmitters.length > 1
                ? `Transmitter ${i + 1}${i === 0 ? ' (high range)' : ' (low range)'}`
                : 'Transmitter 1'}
            </AppText>
            <TextField
              label={`Span (upper range value from zero), ${set.differentialPressure.label}`}
              value={t.span}
              onChangeText={(span) => editTransmitter(i, { span }, `span${i}`)}
              error={problems[`span${i}`]}
              testID={`range-check-span${i}`}
              inputMode="decimal"
              onSubmitEditing={onSubmit}
            />
            <TextField
              label="Accuracy, % of span"
              value={t.accuracy}
              onChangeText={(accuracy) => editTransmitter(i, { accuracy }, `accuracy${i}`)}
              error={problems[`accuracy${i}`]}
              testID={`range-check-accuracy${i}`}
              inputMode="decimal"
              onSubmitEditing={onSubmit}
            />
          </View>
        ))}
        <View style={styles.row}>
          {values.transmitters.length < 2 ? (
            <Button
              label="Add a low-range transmitter"
              size="compact"
              onPress={() =>
                onEdit({
                  transmitters: [
                    ...values.transmitters,
                    { span: '', accuracy: values.transmitters[0]?.accuracy ?? '0.075' },
                  ],
                })
              }
              testID="range-check-add-transmitter"
            />
          ) : (
            <Button
              label="Remove transmitter 2"
              size="compact"
              variant="quiet"
              onPress={() => onEdit({ transmitters: values.transmitters.slice(0, 1) })}
            />
          )}
        </View>
        {text(
          'uncertaintyLimit',
          'Flow uncertainty limit, % (k = 2)',
          'Expanded uncertainty the meter run must meet, e.g. 1 %.',
        )}
      </Section>

      <View style={[styles.submit, wide && styles.submitWide]}>
        {problems.form ? <AppText tone="error" testID="range-check-form-error">{`⊗ ${problems.form}`}</AppText> : null}
        <Button label="Check the range" variant="primary" onPress={onSubmit} testID="range-check-submit" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  sections: { gap: space.lg },
  sectionsWide: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-start' },
  sectionWide: { flexGrow: 1, flexBasis: 330, maxWidth: 540 },
  transmitter: { gap: space.sm, paddingBottom: space.sm },
  row: { flexDirection: 'row' },
  submit: { gap: space.sm, alignItems: 'flex-start' },
  submitWide: { width: '100%' },
});
