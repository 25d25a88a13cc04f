/**
 * The fluid's fields: its kind, then what that kind needs: a natural gas's composition (mole
 * fractions or mol %, with the running sum), an ideal gas's molar mass, a liquid's density
 * line; and optional overrides of the isentropic exponent and viscosity.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { StateBadge } from '@/components/ui/StateBadge';
import { space } from '@/constants/theme';
import type { DetailComponent } from '@/shared/fluids/aga8/detail-constants';
import { FieldRow } from './FieldRow';
import { errorFor, fieldTestID, type FieldErrors } from './formFields';
import {
  commonComponents,
  compositionFromDraft,
  compositionUnitOfSum,
  otherComponents,
  switchCompositionUnit,
  type FluidDraft,
  type FluidKind,
} from './fluidDraft';
import { NumberField } from './NumberField';

const kindOptions: { value: FluidKind; label: string }[] = [
  { value: 'natural-gas', label: 'Natural gas' },
  { value: 'steam', label: 'Steam' },
  { value: 'water', label: 'Water' },
  { value: 'ideal-gas', label: 'Other gas (ideal)' },
  { value: 'liquid', label: 'Other liquid' },
];
const compositionUnitOptions = [
  { value: 'fraction' as const, label: 'Mole fraction (0–1)' },
  { value: 'percent' as const, label: 'mol %' },
];

/** Labels of the fluid's field paths, for the form's summary of problems. */
export const fluidFieldLabels: Record<string, string> = {
  'fluid.kind': 'Fluid',
  'fluid.composition': 'Gas composition',
  'fluid.molarMassKgPerMol': 'Molar mass',
  'fluid.compressibility': 'Compressibility',
  'fluid.densityKgPerM3': 'Density',
  'fluid.referenceTemperatureK': 'Density reference temperature',
  'fluid.expansionPerK': 'Volumetric expansion',
  'fluid.isentropicExponent': 'Isentropic exponent',
  'fluid.viscosityPaS': 'Viscosity',
};

/** The schema's tolerance on the sum of mole fractions (shared/schemas/flow-case.ts). */
const sumTolerance = 0.01;

interface FluidFieldsProps {
  draft: FluidDraft;
  onChange: (draft: FluidDraft) => void;
  errors: FieldErrors;
  testPrefix: string;
}

function CompositionFields({ draft, onChange, errors, testPrefix }: FluidFieldsProps) {
  const [showAll, setShowAll] = useState(() => otherComponents.some((name) => draft.composition[name]));
  const sum = Object.values(compositionFromDraft(draft)).reduce(
    (total, value) => total + (Number.isFinite(value) ? value : 0),
    0,
  );
  const off = Math.abs(sum - 1) > sumTolerance;
  const percent = draft.compositionUnit === 'percent';
  const typedIn = compositionUnitOfSum(draft);
  const setComponent = (name: DetailComponent) => (text: string) =>
    onChange({ ...draft, composition: { ...draft.composition, [name]: text } });
  const error = errorFor(errors, 'fluid.composition');
  const names = showAll ? [...commonComponents, ...otherComponents] : commonComponents;

  return (
    <View style={styles.group} testID={fieldTestID(testPrefix, 'fluid.composition')}>
      <ChoiceGroup
        label="Composition typed as"
        options={compositionUnitOptions}
        value={draft.compositionUnit}
        onChange={(compositionUnit) => onChange(switchCompositionUnit(draft, compositionUnit))}
        testIDPrefix={fieldTestID(testPrefix, 'fluid.compositionUnit')}
      />
      <FieldRow>
        {names.map((name) => (
          <NumberField
            key={name}
            compact
            label={name}
            value={draft.composition[name] ?? ''}
            onChangeText={setComponent(name)}
            error={errors[`fluid.composition.${name}`]}
            testID={fieldTestID(testPrefix, `fluid.composition.${name}`)}
          />
        ))}
      </FieldRow>
      <View style={styles.sumRow}>
        <AppText variant="label" tabular testID={fieldTestID(testPrefix, 'fluid.composition-sum')}>
          {percent ? `Sum ${(sum * 100).toFixed(2)} mol %` : `Sum ${sum.toFixed(4)} (mole fraction)`}
        </AppText>
        {off && sum > 0 ? (
          <StateBadge
            priority="low"
            variant="inline"
            label={`must add up to ${percent ? '100 mol %' : '1'} (within ${percent ? '1 mol %' : '0.01'})`}
          />
        ) : null}
        <Button
          size="compact"
          variant="quiet"
          label={
            showAll
              ? 'Show the usual components only'
              : `Show all ${commonComponents.length + otherComponents.length} components`
          }
          onPress={() => setShowAll((all) => !all)}
        />
      </View>
      {typedIn && typedIn !== draft.compositionUnit ? (
        <AppText variant="caption" tone="muted" testID={fieldTestID(testPrefix, 'fluid.composition-unit-hint')}>
          {typedIn === 'percent'
            ? 'These add up to about 100: if they are mol %, choose mol % above; the numbers stay as typed.'
            : 'These add up to about 1: if they are mole fractions, choose mole fraction above; the numbers stay as typed.'}
        </AppText>
      ) : null}
      {error ? (
        <AppText variant="caption" tone="error" testID={`${fieldTestID(testPrefix, 'fluid.composition')}-error`}>
          {`⊗ ${error}`}
        </AppText>
      ) : null}
    </View>
  );
}

export function FluidFields(props: FluidFieldsProps) {
  const { draft, onChange, errors, testPrefix } = props;
  const set =
    <K extends keyof FluidDraft>(key: K) =>
    (value: FluidDraft[K]) =>
      onChange({ ...draft, [key]: value });
  const id = (key: string) => fieldTestID(testPrefix, `fluid.${key}`);
  const error = (key: string) => errorFor(errors, `fluid.${key}`);

  return (
    <View style={styles.group}>
      <ChoiceGroup
        label="Kind"
        options={kindOptions}
        value={draft.kind}
        onChange={set('kind')}
        testIDPrefix={id('kind')}
      />
      {draft.kind === 'natural-gas' ? (
        <>
          <AppText variant="caption" tone="muted">
            Density and compressibility from AGA 8 DETAIL, heating value from ISO 6976, both from this composition: take
            it from the latest gas analysis.
          </AppText>
          <CompositionFields {...props} />
        </>
      ) : null}
      {draft.kind === 'steam' || draft.kind === 'water' ? (
        <AppText variant="caption" tone="muted">
          Density, enthalpy and viscosity from IAPWS-IF97 at the measured pressure and temperature.
        </AppText>
      ) : null}
      {draft.kind === 'ideal-gas' ? (
        <FieldRow>
          <NumberField
            label="Molar mass (g/mol)"
            value={draft.molarMassGPerMol}
            onChangeText={set('molarMassGPerMol')}
            error={error('molarMassKgPerMol')}
            hint="Air 28.97"
            testID={id('molarMassKgPerMol')}
          />
          <NumberField
            label="Compressibility Z (optional)"
            value={draft.compressibility}
            onChangeText={set('compressibility')}
            error={error('compressibility')}
            hint="Empty: 1"
            testID={id('compressibility')}
          />
        </FieldRow>
      ) : null}
      {draft.kind === 'liquid' ? (
        <FieldRow>
          <NumberField
            label="Density (kg/m³)"
            value={draft.densityKgPerM3}
            onChangeText={set('densityKgPerM3')}
            error={error('densityKgPerM3')}
            testID={id('densityKgPerM3')}
          />
          <NumberField
            label="at temperature (°C)"
            value={draft.referenceTemperatureC}
            onChangeText={set('referenceTemperatureC')}
            error={error('referenceTemperatureK')}
            testID={id('referenceTemperatureK')}
          />
          <NumberField
            label="Volumetric expansion (1/K)"
            value={draft.expansionPerK}
            onChangeText={set('expansionPerK')}
            error={error('expansionPerK')}
            hint="e.g. 0.0009 for a light oil"
            testID={id('expansionPerK')}
          />
        </FieldRow>
      ) : null}
      <FieldRow>
        <NumberField
          label="Isentropic exponent κ (optional)"
          value={draft.isentropicExponent}
          onChangeText={set('isentropicExponent')}
          error={error('isentropicExponent')}
          hint="Empty: from the fluid’s properties."
          testID={id('isentropicExponent')}
        />
        <NumberField
          label="Viscosity (Pa·s, optional)"
          value={draft.viscosityPaS}
          onChangeText={set('viscosityPaS')}
          error={error('viscosityPaS')}
          hint="Empty: from the fluid’s properties."
          testID={id('viscosityPaS')}
        />
      </FieldRow>
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.md },
  sumRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
});
