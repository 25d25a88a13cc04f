/**
 * A new configuration version of a meter run: the element and fluid from a given moment on
 * (an element swap, a new gas analysis), with the reason. The form starts from the version in
 * force. A moment in the past recomputes the history from then on, which the form says in
 * words before it is sent. A bi-directional meter run's version carries the element's constants
 * in reverse flow and the direction source too (prefilled from the version in force); leaving
 * them out makes the run one-way from the version's time, so the form asks for them while
 * "Flow in both directions" stays yes.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { StateBadge } from '@/components/ui/StateBadge';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { useCreateConfigVersion, type ConfigVersion, type MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import type { ElementSpec } from '@/shared/flow/flow-types';
import type { FluidSpec } from '@/shared/fluids/fluid-types';
import { configVersionSchema } from '@/shared/schemas/setup';
import { ElementAndFluidSections } from './ElementAndFluidSections';
import { elementFieldLabels, reverseElementFieldLabels } from './ElementFields';
import {
  draftFromElement,
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
import { draftFromFluid, emptyFluidDraft, fluidFromDraft, type FluidDraft } from './fluidDraft';
import { FormErrorSummary } from './FormErrorSummary';
import { fieldErrorFromServer, fieldErrorsFromZod, fieldTestID, type FieldErrors } from './formFields';
import { ReverseFlowSection } from './ReverseFlowSection';
import { formatOnSiteClock, siteClockNow, zonedIso } from './zonedTime';

/** An effective time this little in the past is taken as now, not as a back-dating. */
const backDatingGraceMs = 5 * 60 * 1000;

/** The server's words when a bi-directional meter run's version has no reverse constants (shared/schemas/setup.ts). */
const REVERSE_ELEMENT_REQUIRED = "required for a bi-directional meter run: the element's constants in reverse flow";

const labels: Record<string, string> = {
  effectiveFrom: 'Effective from',
  reason: 'Reason',
  ...elementFieldLabels,
  ...fluidFieldLabels,
  reverseElement: 'Element in reverse flow',
  directionSource: 'Direction of flow from',
  ...reverseElementFieldLabels,
};

/** The reverse-flow draft of the version in force: its reverse constants and direction source, or none on a one-way run. */
function reverseDraftOf(meterRun: MeterRun, lengthUnit: ElementDraft['lengthUnit']): ReverseDraft {
  if (!meterRun.reverseElement) return emptyReverseDraft;
  return {
    element: draftFromElement(meterRun.reverseElement as ElementSpec, lengthUnit),
    copiedUnconfirmed: false,
    directionSource: meterRun.directionSource ?? 'dp-sign',
  };
}

interface ConfigVersionFormProps {
  meterRun: MeterRun;
  site: Site;
  /** Called with the stored version; its `recompute` says which recorded hours are being recomputed. */
  onDone?: (created: ConfigVersion) => void;
  onCancel?: () => void;
}

export function ConfigVersionForm({ meterRun, site, onDone, onCancel }: ConfigVersionFormProps) {
  const create = useCreateConfigVersion(meterRun.id);
  const prefix = 'version-create';
  const lengthUnit = site.displayUnits === 'us' ? 'in' : 'mm';
  const [effective, setEffective] = useState(() => siteClockNow(site.timeZone, Date.now()));
  const [reason, setReason] = useState('');
  const [element, setElement] = useState<ElementDraft>(() =>
    meterRun.element
      ? draftFromElement(meterRun.element as ElementSpec, lengthUnit)
      : { ...emptyElementDraft, lengthUnit },
  );
  const [fluid, setFluid] = useState<FluidDraft>(() =>
    meterRun.fluid ? draftFromFluid(meterRun.fluid as FluidSpec) : emptyFluidDraft,
  );
  const [bidirectional, setBidirectional] = useState<'yes' | 'no'>(meterRun.reverseElement ? 'yes' : 'no');
  const [reverse, setReverse] = useState<ReverseDraft>(() => reverseDraftOf(meterRun, lengthUnit));
  const [errors, setErrors] = useState<FieldErrors>({});

  const effectiveFrom = zonedIso(effective.date, effective.time, site.timeZone);
  const effectiveMs = Date.parse(effectiveFrom);
  // Minutes ago is "now" for someone recording a change just made; older than that is a back-dating.
  const backDated = Number.isFinite(effectiveMs) && effectiveMs < Date.now() - backDatingGraceMs;

  const touched = () => {
    if (create.error) create.reset();
  };

  const submit = () => {
    const parsed = configVersionSchema.safeParse({
      effectiveFrom,
      element: elementFromDraft(element),
      fluid: fluidFromDraft(fluid),
      reason,
      ...reverseFromDraft(bidirectional === 'yes', reverse),
    });
    // A version without reverse constants makes the run one-way from its time: only when "No" is chosen.
    const reverseProblem =
      bidirectional !== 'yes'
        ? undefined
        : reverse.element === null
          ? REVERSE_ELEMENT_REQUIRED
          : reverse.copiedUnconfirmed
            ? REVERSE_COPY_UNCONFIRMED
            : undefined;
    if (!parsed.success || reverseProblem) {
      setErrors({
        ...(parsed.success ? {} : fieldErrorsFromZod(parsed.error)),
        ...(reverseProblem ? { reverseElement: reverseProblem } : {}),
      });
      return;
    }
    setErrors({});
    create.mutate(parsed.data, { onSuccess: (created) => onDone?.(created) });
  };

  const serverErrors = fieldErrorFromServer(create.error);
  const shown: FieldErrors = { ...serverErrors, ...errors };
  const general = create.error && !serverErrors ? create.error.message : null;
  const id = (key: string) => fieldTestID(prefix, key);

  return (
    <View style={styles.form} testID={prefix}>
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
            label={`Effective date (${site.timeZone})`}
            value={effective.date}
            onChangeText={(date) => {
              setEffective((current) => ({ ...current, date }));
              touched();
            }}
            error={shown.effectiveFrom}
            hint="YYYY-MM-DD on the site’s clock"
            testID={id('effectiveFrom')}
          />
        </View>
        <View style={styles.field}>
          <TextField
            label="Effective time"
            value={effective.time}
            onChangeText={(time) => {
              setEffective((current) => ({ ...current, time }));
              touched();
            }}
            hint="HH:MM, 24 h"
            testID={id('effectiveTime')}
          />
        </View>
      </FieldRow>
      {backDated ? (
        <StateBadge
          priority="medium"
          testID={`${prefix}-backdated`}
          label={`Back-dated: saving this recomputes every hourly record, contract day and monthly total of ${meterRun.tag} from ${formatOnSiteClock(effectiveFrom, site.timeZone)} on (closed months stay as they are).`}
        />
      ) : null}
      <TextField
        label="Reason"
        value={reason}
        onChangeText={(text) => {
          setReason(text);
          touched();
        }}
        error={shown.reason}
        hint="What changed and why, e.g. “Cone swapped for β 0.45, certificate 2291”. It goes into the audit trail."
        testID={id('reason')}
        multiline
        numberOfLines={2}
      />
      <ElementAndFluidSections
        element={element}
        fluid={fluid}
        onElementChange={setElement}
        onFluidChange={setFluid}
        onEdited={touched}
        errors={shown}
        testPrefix={prefix}
        titles={{ element: 'Primary element from then on', fluid: 'Fluid from then on' }}
      />
      <ReverseFlowSection
        bidirectional={bidirectional}
        onBidirectionalChange={(next) => {
          setBidirectional(next);
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
        description={
          meterRun.reverseElement
            ? 'From the version in force: bi-directional. Choosing No makes the meter run one-way from this version’s time.'
            : 'From the version in force: one way. Choosing Yes makes the meter run bi-directional from this version’s time.'
        }
      />
      <Notice>
        A version dated in the past recomputes this meter run’s hourly records, contract days and monthly totals from
        that moment on (closed months excepted); hours before it keep the version then in force. A version dated ahead
        takes effect when its time comes.
      </Notice>
      <View style={styles.actions}>
        <Button
          label={backDated ? 'Add version and recompute' : 'Add version'}
          variant="primary"
          onPress={submit}
          busy={create.isPending}
          testID={`${prefix}-submit`}
        />
        {onCancel ? <Button label="Cancel" variant="quiet" onPress={onCancel} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
