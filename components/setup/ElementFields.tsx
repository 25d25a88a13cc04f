/**
 * The primary element's fields: the kind and its own sub-type (orifice taps, venturi or nozzle
 * type), diameters in mm or inches, and the optional fixed C, calibration curve, materials and
 * reference temperature. Below them, β and any limit of the standard the geometry breaks,
 * worked out by the shared flow code itself (prepareElement), so the form and the server agree.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { StateBadge } from '@/components/ui/StateBadge';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT } from '@/shared/flow/cone-discharge-coefficient';
import { DEFAULT_REFERENCE_TEMPERATURE_K } from '@/shared/flow/thermal-expansion';
import { prepareElement } from '@/shared/flow/prepare-element';
import type {
  ElementKind,
  ElementSpec,
  ExpansionReference,
  MaterialName,
  NozzleType,
  OrificeMethod,
  OrificeTaps,
  VenturiType,
} from '@/shared/flow/flow-types';
import { elementSpecSchema } from '@/shared/schemas/flow-case';
import { elementFromDraft, type ElementDraft } from './elementDraft';
import { FieldRow } from './FieldRow';
import { convertNumberText, errorFor, fieldTestID, type FieldErrors } from './formFields';
import { NumberField } from './NumberField';
import { lengthFromMetres, lengthToMetres, lengthUnits, type LengthUnit } from './unitChoices';

const kindOptions: { value: ElementKind; label: string }[] = [
  { value: 'orifice', label: 'Orifice plate' },
  { value: 'venturi', label: 'Venturi' },
  { value: 'nozzle', label: 'Nozzle' },
  { value: 'cone', label: 'Cone' },
];
const tapsOptions: { value: OrificeTaps; label: string }[] = [
  { value: 'flange', label: 'Flange taps' },
  { value: 'corner', label: 'Corner taps' },
  { value: 'D-D/2', label: 'D and D/2 taps' },
];
const methodOptions: { value: OrificeMethod; label: string }[] = [
  { value: 'iso-5167-2', label: 'ISO 5167-2:2003' },
  { value: 'api-14.3', label: 'API MPMS 14.3 / AGA 3 (flange taps)' },
];
const expansionReferenceOptions: { value: ExpansionReference; label: string }[] = [
  { value: 'upstream', label: 'Upstream tap (Y1)' },
  { value: 'downstream', label: 'Downstream tap (Y2)' },
];
const venturiOptions: { value: VenturiType; label: string }[] = [
  { value: 'as-cast', label: 'As-cast' },
  { value: 'machined', label: 'Machined' },
  { value: 'rough-welded', label: 'Rough-welded sheet-iron' },
];
const nozzleOptions: { value: NozzleType; label: string }[] = [
  { value: 'isa-1932', label: 'ISA 1932' },
  { value: 'long-radius', label: 'Long radius' },
];
const materialOptions: { value: MaterialName | ''; label: string }[] = [
  { value: '', label: 'Not given' },
  { value: 'carbon-steel', label: 'Carbon steel' },
  { value: 'stainless-304', label: 'Stainless 304' },
  { value: 'stainless-316', label: 'Stainless 316' },
  { value: 'uns-n04400', label: 'UNS N04400 (Ni-Cu)' },
  { value: 'uns-n10276', label: 'UNS N10276 (Ni-Mo-Cr)' },
];

const coefficientSourceOptions: { value: ElementDraft['fixedCoefficientSource']; label: string }[] = [
  { value: 'none', label: 'Not calibrated' },
  { value: 'calibration', label: 'From a calibration' },
];

/** Labels of the element's field paths, for the form's summary of problems. */
export const elementFieldLabels: Record<string, string> = {
  'element.kind': 'Element kind',
  'element.taps': 'Orifice taps',
  'element.method': 'Orifice method',
  'element.expansionReference': 'Static tap of the expansion factor',
  'element.venturiType': 'Venturi type',
  'element.nozzleType': 'Nozzle type',
  'element.pipeDiameterM': 'Pipe inside diameter',
  'element.boreDiameterM': 'Bore (throat) diameter',
  'element.coneDiameterM': 'Cone diameter',
  'element.dischargeCoefficient': 'Fixed discharge coefficient',
  'element.calibration': 'Calibration curve',
  'element.dischargeCoefficientCalibrated': 'Source of the fixed C',
  'element.calibrationUncertaintyPercent': 'Calibration uncertainty of C',
  'element.calibrationLaboratory': 'Calibrated by',
  'element.referenceTemperatureK': 'Reference temperature',
};

/** The same labels for the element's constants in reverse flow (a bi-directional meter run). */
export const reverseElementFieldLabels: Record<string, string> = Object.fromEntries(
  Object.entries(elementFieldLabels).map(([path, label]) => [
    path.replace(/^element\./, 'reverseElement.'),
    `Reverse flow: ${label.charAt(0).toLowerCase()}${label.slice(1)}`,
  ]),
);

/** β and geometry warnings of a complete element, or null while the draft is not one yet. */
function geometryOf(draft: ElementDraft): { beta: number; warnings: string[] } | null {
  const parsed = elementSpecSchema.safeParse(elementFromDraft(draft));
  if (!parsed.success) return null;
  try {
    const spec = parsed.data as ElementSpec;
    const prepared = prepareElement(spec, spec.referenceTemperatureK ?? DEFAULT_REFERENCE_TEMPERATURE_K);
    return { beta: prepared.beta, warnings: prepared.warnings.map((warning) => warning.message) };
  } catch (error) {
    return { beta: Number.NaN, warnings: [error instanceof Error ? error.message : String(error)] };
  }
}

interface ElementFieldsProps {
  draft: ElementDraft;
  onChange: (draft: ElementDraft) => void;
  errors: FieldErrors;
  /** Test ids start with this, e.g. "run-create". */
  testPrefix: string;
  /** The body field the element goes in: 'element', or 'reverseElement' on a bi-directional meter run. */
  field?: 'element' | 'reverseElement';
}

export function ElementFields({ draft, onChange, errors, testPrefix, field = 'element' }: ElementFieldsProps) {
  const set =
    <K extends keyof ElementDraft>(key: K) =>
    (value: ElementDraft[K]) =>
      onChange({ ...draft, [key]: value });
  const id = (key: string) => fieldTestID(testPrefix, `${field}.${key}`);
  const error = (key: string) => errorFor(errors, `${field}.${key}`);
  const geometry = geometryOf(draft);
  const changeLengthUnit = (unit: LengthUnit) => {
    const convert = (text: string) =>
      convertNumberText(text, (value) => lengthFromMetres(lengthToMetres(value, draft.lengthUnit), unit));
    onChange({
      ...draft,
      lengthUnit: unit,
      pipeDiameter: convert(draft.pipeDiameter),
      boreDiameter: convert(draft.boreDiameter),
      coneDiameter: convert(draft.coneDiameter),
    });
  };
  const unitLabel = draft.lengthUnit;

  return (
    <View style={styles.group}>
      <ChoiceGroup
        label="Kind"
        options={kindOptions}
        value={draft.kind}
        onChange={set('kind')}
        testIDPrefix={id('kind')}
      />
      {draft.kind === 'orifice' ? (
        <ChoiceGroup
          label="Pressure taps"
          options={tapsOptions}
          value={draft.taps}
          onChange={set('taps')}
          testIDPrefix={id('taps')}
        />
      ) : null}
      {draft.kind === 'orifice' ? (
        <ChoiceGroup
          label="Method"
          options={methodOptions}
          value={draft.method}
          onChange={set('method')}
          testIDPrefix={id('method')}
        />
      ) : null}
      {draft.kind === 'orifice' && draft.method === 'api-14.3' ? (
        <ChoiceGroup
          label="Static pressure measured at (as installed)"
          options={expansionReferenceOptions}
          value={draft.expansionReference}
          onChange={set('expansionReference')}
          testIDPrefix={id('expansionReference')}
        />
      ) : null}
      {draft.kind === 'orifice' && draft.method === 'api-14.3' ? (
        <AppText variant="caption" tone="muted">
          The tap the static-pressure transmitter is connected to: its reading is taken as the pressure at that tap.
          Moving a transmitter to the other tap is field work on a line under pressure (see the safety note).
        </AppText>
      ) : null}
      {draft.kind === 'venturi' ? (
        <ChoiceGroup
          label="Venturi type"
          options={venturiOptions}
          value={draft.venturiType}
          onChange={set('venturiType')}
          testIDPrefix={id('venturiType')}
        />
      ) : null}
      {draft.kind === 'nozzle' ? (
        <ChoiceGroup
          label="Nozzle type"
          options={nozzleOptions}
          value={draft.nozzleType}
          onChange={set('nozzleType')}
          testIDPrefix={id('nozzleType')}
        />
      ) : null}

      <ChoiceGroup
        label="Diameters typed in"
        options={lengthUnits}
        value={draft.lengthUnit}
        onChange={changeLengthUnit}
        testIDPrefix={id('lengthUnit')}
      />
      <FieldRow>
        <NumberField
          label={`Pipe inside diameter D (${unitLabel})`}
          value={draft.pipeDiameter}
          onChangeText={set('pipeDiameter')}
          error={error('pipeDiameterM')}
          testID={id('pipeDiameterM')}
        />
        {draft.kind === 'cone' ? (
          <NumberField
            label={`Cone diameter (${unitLabel})`}
            value={draft.coneDiameter}
            onChangeText={set('coneDiameter')}
            error={error('coneDiameterM')}
            testID={id('coneDiameterM')}
          />
        ) : (
          <NumberField
            label={`${draft.kind === 'orifice' ? 'Bore' : 'Throat'} diameter d (${unitLabel})`}
            value={draft.boreDiameter}
            onChangeText={set('boreDiameter')}
            error={error('boreDiameterM')}
            testID={id('boreDiameterM')}
          />
        )}
        <NumberField
          label="Diameters measured at (°C)"
          value={draft.referenceTemperatureC}
          onChangeText={set('referenceTemperatureC')}
          error={error('referenceTemperatureK')}
          hint="Empty: 20 °C."
          testID={id('referenceTemperatureK')}
        />
      </FieldRow>
      {geometry ? (
        <View style={styles.geometry} testID={id('geometry')}>
          <AppText variant="label" tabular>
            {Number.isFinite(geometry.beta) ? `β = ${geometry.beta.toFixed(4)}` : 'β cannot be worked out'}
          </AppText>
          {geometry.warnings.map((warning) => (
            <StateBadge key={warning} priority="low" variant="inline" label={warning} />
          ))}
        </View>
      ) : null}

      <FieldRow>
        <View style={styles.choice}>
          <ChoiceGroup
            label="Pipe material"
            options={materialOptions}
            value={draft.pipeMaterial}
            onChange={set('pipeMaterial')}
            testIDPrefix={id('pipeMaterial')}
          />
        </View>
        <View style={styles.choice}>
          <ChoiceGroup
            label="Element material"
            options={materialOptions}
            value={draft.elementMaterial}
            onChange={set('elementMaterial')}
            testIDPrefix={id('elementMaterial')}
          />
        </View>
      </FieldRow>
      <AppText variant="caption" tone="muted">
        Materials correct the diameters for thermal expansion at the flowing temperature; without them the diameters are
        used as measured.
      </AppText>

      <FieldRow>
        <NumberField
          label="Fixed discharge coefficient C (optional)"
          value={draft.dischargeCoefficient}
          onChangeText={set('dischargeCoefficient')}
          error={error('dischargeCoefficient')}
          hint={
            draft.kind === 'cone'
              ? `Empty with no curve: ${UNCALIBRATED_CONE_DISCHARGE_COEFFICIENT}, the uncalibrated cone value.`
              : 'Empty: C from the standard’s equation.'
          }
          testID={id('dischargeCoefficient')}
        />
        <View style={styles.calibration}>
          <TextField
            label="Calibration curve (optional): Re_D, C per line"
            value={draft.calibration}
            onChangeText={set('calibration')}
            error={error('calibration')}
            hint="From the laboratory certificate, e.g. “150000, 0.812”. Give a curve or a fixed C, not both."
            testID={id('calibration')}
            multiline
            numberOfLines={3}
            autoCorrect={false}
          />
        </View>
      </FieldRow>
      <FieldRow>
        <View style={styles.choice}>
          <ChoiceGroup
            label="Source of the fixed C"
            options={coefficientSourceOptions}
            value={draft.fixedCoefficientSource}
            onChange={set('fixedCoefficientSource')}
            testIDPrefix={id('dischargeCoefficientCalibrated')}
          />
        </View>
        <NumberField
          label="Calibration uncertainty of C, % (k = 2)"
          value={draft.calibrationUncertaintyPercent}
          onChangeText={set('calibrationUncertaintyPercent')}
          error={error('calibrationUncertaintyPercent')}
          hint="The certificate’s expanded uncertainty of C: needed for a calibrated fixed C, optional for a curve."
          testID={id('calibrationUncertaintyPercent')}
        />
        <View style={styles.calibration}>
          <TextField
            label="Calibrated by (optional)"
            value={draft.calibrationLaboratory}
            onChangeText={set('calibrationLaboratory')}
            error={error('calibrationLaboratory')}
            hint="Laboratory and certificate reference."
            testID={id('calibrationLaboratory')}
            autoCorrect={false}
          />
        </View>
      </FieldRow>
      <AppText variant="caption" tone="muted">
        A fixed C not from a calibration is given the uncertainty of the element’s part of ISO 5167 (5 % for a cone).
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.md },
  geometry: { gap: space.xs },
  choice: { flexGrow: 1, flexBasis: 280, minWidth: 240 },
  calibration: { flexGrow: 1, flexBasis: 280, minWidth: 200 },
});
