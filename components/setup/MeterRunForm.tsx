/**
 * A new meter run of a site: tag and name, the primary element and the fluid (its first
 * configuration version), line data, and the limits the history uses (hold limit, longest
 * gap, stacked-pair switch points). Checked with the server's own meterRunSchema first.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { useCreateMeterRun, type MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { meterRunSchema } from '@/shared/schemas/setup';
import { ElementAndFluidSections } from './ElementAndFluidSections';
import { elementFieldLabels, reverseElementFieldLabels } from './ElementFields';
import {
  elementFromDraft,
  emptyElementDraft,
  emptyReverseDraft,
  REVERSE_COPY_UNCONFIRMED,
  reverseFromDraft,
  type ElementDraft,
  type ReverseDraft,
} from './elementDraft';
import { FieldRow } from './FieldRow';
import { fluidFieldLabels } from './FluidFields';
import { emptyFluidDraft, fluidFromDraft, type FluidDraft } from './fluidDraft';
import { FormErrorSummary } from './FormErrorSummary';
import { FormSection } from './FormSection';
import {
  fieldErrorFromServer,
  fieldErrorsFromZod,
  fieldTestID,
  optionalText,
  parseNumberText,
  type FieldErrors,
} from './formFields';
import { emptyLineDraft, LineFields, lineFieldLabels, lineFromDraft, type LineDraft } from './LineFields';
import { NumberField } from './NumberField';
import { ReverseFlowSection } from './ReverseFlowSection';
import { zonedIso } from './zonedTime';

interface RunDraft {
  tag: string;
  name: string;
  holdLimitS: string;
  maxGapS: string;
  switchUpPercent: string;
  switchDownPercent: string;
  effectiveDate: string;
  effectiveTime: string;
}

/** The schema's defaults (shared/schemas/setup.ts), shown so the engineer sees what applies. */
const emptyRunDraft: RunDraft = {
  tag: '',
  name: '',
  holdLimitS: '60',
  maxGapS: '300',
  switchUpPercent: '90',
  switchDownPercent: '80',
  effectiveDate: '',
  effectiveTime: '',
};

const labels: Record<string, string> = {
  siteId: 'Site',
  tag: 'Tag',
  name: 'Name',
  holdLimitS: 'Hold limit',
  maxGapS: 'Gap limit',
  stackSwitchUpShare: 'Switch up to the high range at',
  stackSwitchDownShare: 'Switch back down at',
  effectiveFrom: 'First configuration effective from',
  ...elementFieldLabels,
  ...fluidFieldLabels,
  ...lineFieldLabels,
  reverseElement: 'Element in reverse flow',
  directionSource: 'Direction of flow from',
  ...reverseElementFieldLabels,
};

const fractionPerPercent = 0.01;

interface MeterRunFormProps {
  site: Site;
  onDone?: (run: MeterRun) => void;
}

export function MeterRunForm({ site, onDone }: MeterRunFormProps) {
  const create = useCreateMeterRun();
  const prefix = 'run-create';
  const [run, setRun] = useState<RunDraft>(emptyRunDraft);
  const [element, setElement] = useState<ElementDraft>(() => ({
    ...emptyElementDraft,
    lengthUnit: site.displayUnits === 'us' ? 'in' : 'mm',
  }));
  const [fluid, setFluid] = useState<FluidDraft>(emptyFluidDraft);
  const [line, setLine] = useState<LineDraft>(() => ({
    ...emptyLineDraft,
    lengthUnit: site.displayUnits === 'us' ? 'in' : 'mm',
  }));
  const [reverse, setReverse] = useState<ReverseDraft>(emptyReverseDraft);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [added, setAdded] = useState<string | null>(null);

  const touched = () => {
    setAdded(null);
    if (create.error) create.reset();
  };
  const editRun = (key: keyof RunDraft) => (text: string) => {
    setRun((current) => ({ ...current, [key]: text }));
    touched();
  };

  const submit = () => {
    const up = parseNumberText(run.switchUpPercent);
    const down = parseNumberText(run.switchDownPercent);
    const effectiveDate = optionalText(run.effectiveDate);
    const body = {
      siteId: site.id,
      tag: run.tag,
      name: run.name,
      element: elementFromDraft(element),
      fluid: fluidFromDraft(fluid),
      holdLimitS: parseNumberText(run.holdLimitS),
      maxGapS: parseNumberText(run.maxGapS),
      stackSwitchUpShare: up === undefined ? undefined : up * fractionPerPercent,
      stackSwitchDownShare: down === undefined ? undefined : down * fractionPerPercent,
      line: lineFromDraft(line),
      effectiveFrom: effectiveDate ? zonedIso(effectiveDate, run.effectiveTime, site.timeZone) : undefined,
      ...reverseFromDraft(line.bidirectional === 'yes', reverse),
    };
    const parsed = meterRunSchema.safeParse(body);
    const unconfirmed = line.bidirectional === 'yes' && reverse.copiedUnconfirmed;
    if (!parsed.success || unconfirmed) {
      setErrors({
        ...(parsed.success ? {} : fieldErrorsFromZod(parsed.error)),
        ...(unconfirmed ? { reverseElement: REVERSE_COPY_UNCONFIRMED } : {}),
      });
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (created) => {
        setAdded(`Added ${created.tag} · ${created.name}. Add its transmitters next.`);
        setRun(emptyRunDraft);
        setReverse(emptyReverseDraft);
        onDone?.(created);
      },
    });
  };

  const serverErrors = fieldErrorFromServer(create.error);
  const shown: FieldErrors = { ...serverErrors, ...errors };
  const general = create.error && !serverErrors ? create.error.message : null;
  const id = (key: string) => fieldTestID(prefix, key);

  return (
    <View style={styles.form} testID={prefix}>
      {added ? <Notice testID={`${prefix}-done`}>{added}</Notice> : null}
      <FormErrorSummary
        errors={shown}
        labels={labels}
        general={general}
        testID={`${prefix}-errors`}
        fieldPrefix={prefix}
      />
      <FieldRow>
        <View style={styles.field}>
          <TextField
            label="Tag"
            value={run.tag}
            onChangeText={editRun('tag')}
            error={shown.tag}
            hint="e.g. KFG-104: letters, digits, ., - and _."
            testID={id('tag')}
            autoCapitalize="characters"
            autoCorrect={false}
          />
        </View>
        <View style={styles.field}>
          <TextField
            label="Name"
            value={run.name}
            onChangeText={editRun('name')}
            error={shown.name}
            hint="e.g. Pad 4 wellhead"
            testID={id('name')}
          />
        </View>
      </FieldRow>

      <ElementAndFluidSections
        element={element}
        fluid={fluid}
        onElementChange={setElement}
        onFluidChange={setFluid}
        onEdited={touched}
        errors={shown}
        testPrefix={prefix}
        titles={{ element: 'Primary element', fluid: 'Fluid' }}
        sectionTestIDs={{ element: `${prefix}-element`, fluid: `${prefix}-fluid` }}
      />

      <ReverseFlowSection
        bidirectional={line.bidirectional}
        onBidirectionalChange={(bidirectional) => {
          setLine((current) => ({ ...current, bidirectional }));
          touched();
        }}
        forward={element}
        reverse={reverse}
        onReverseChange={(next) => {
          setReverse(next);
          touched();
        }}
        errors={shown}
        testPrefix={prefix}
      />

      <FormSection
        title="Data handling"
        description="The hold limit is how long a static pressure or temperature reading may stand in for the next; a gap between readings longer than the gap limit counts as missing time, not flow. A stacked pair switches up to the high-range DP above the first share of the low-range span and back below the second (hysteresis)."
      >
        <FieldRow>
          <NumberField
            label="Hold limit (s)"
            value={run.holdLimitS}
            onChangeText={editRun('holdLimitS')}
            error={shown.holdLimitS}
            testID={id('holdLimitS')}
          />
          <NumberField
            label="Gap limit (s)"
            value={run.maxGapS}
            onChangeText={editRun('maxGapS')}
            error={shown.maxGapS}
            testID={id('maxGapS')}
          />
          <NumberField
            label="Switch up at (% of low span)"
            value={run.switchUpPercent}
            onChangeText={editRun('switchUpPercent')}
            error={shown.stackSwitchUpShare}
            testID={id('stackSwitchUpShare')}
          />
          <NumberField
            label="Switch back down at (%)"
            value={run.switchDownPercent}
            onChangeText={editRun('switchDownPercent')}
            error={shown.stackSwitchDownShare}
            testID={id('stackSwitchDownShare')}
          />
        </FieldRow>
      </FormSection>

      <FormSection
        title="First configuration effective from (optional)"
        description={`On the site’s clock (${site.timeZone}). Empty: from the start of any history. Readings before this date cannot be turned into flow.`}
        folded
        testID={`${prefix}-effective`}
      >
        <FieldRow>
          <View style={styles.field}>
            <TextField
              label="Date"
              value={run.effectiveDate}
              onChangeText={editRun('effectiveDate')}
              error={shown.effectiveFrom}
              hint="YYYY-MM-DD"
              testID={id('effectiveFrom')}
            />
          </View>
          <View style={styles.field}>
            <TextField
              label="Time"
              value={run.effectiveTime}
              onChangeText={editRun('effectiveTime')}
              hint="HH:MM, 24 h"
              testID={id('effectiveTime')}
            />
          </View>
        </FieldRow>
      </FormSection>

      <FormSection
        title="Line data (optional)"
        description="For the record and the audit: the flow equation uses the element’s diameters."
        folded
        testID={`${prefix}-line`}
      >
        <LineFields
          draft={line}
          onChange={(next) => {
            setLine(next);
            touched();
          }}
          errors={shown}
          testPrefix={prefix}
          showBidirectional={false}
        />
      </FormSection>

      <View style={styles.actions}>
        <Button
          label="Add meter run"
          variant="primary"
          onPress={submit}
          busy={create.isPending}
          testID={`${prefix}-submit`}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
  actions: { flexDirection: 'row', gap: space.sm },
});
