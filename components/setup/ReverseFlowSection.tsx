/**
 * Whether a meter run's flow may run both ways, and on a bi-directional one the element's
 * constants in reverse flow (the same editor as the forward element: a cone or orifice may differ
 * by direction, a calibrated element has its own curve per direction) and where the direction of
 * flow comes from. "Same constants as forward" copies the forward element as a start; the person
 * confirms the copy before it is sent.
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { space } from '@/constants/theme';
import { ElementFields } from './ElementFields';
import { emptyElementDraft, type DirectionSource, type ElementDraft, type ReverseDraft } from './elementDraft';
import { errorFor, fieldTestID, type FieldErrors } from './formFields';
import { FormSection } from './FormSection';

const directionOptions: { value: DirectionSource; label: string }[] = [
  { value: 'dp-sign', label: 'Sign of the DP' },
  { value: 'direction-input', label: 'A direction input' },
];

const directionHints: Record<DirectionSource, string> = {
  'dp-sign':
    'A negative DP is reverse flow: range the DP transmitters below zero (e.g. −250 to +250 inH₂O) so they read both ways.',
  'direction-input':
    'The DP transmitters read the magnitude; a transmitter measuring flow direction (sign: above 0 forward, below 0 reverse, 0 no flow) says which way. Add it with the transmitters.',
};

interface ReverseFlowSectionProps {
  bidirectional: 'yes' | 'no';
  onBidirectionalChange: (value: 'yes' | 'no') => void;
  /** The forward element as typed, copied by "Same constants as forward". */
  forward: ElementDraft;
  reverse: ReverseDraft;
  onReverseChange: (next: ReverseDraft) => void;
  errors: FieldErrors;
  testPrefix: string;
  /** A description of the section, for a form where it needs one. */
  description?: string;
}

export function ReverseFlowSection({
  bidirectional,
  onBidirectionalChange,
  forward,
  reverse,
  onReverseChange,
  errors,
  testPrefix,
  description,
}: ReverseFlowSectionProps) {
  const id = (key: string) => fieldTestID(testPrefix, key);
  const missing = errorFor(errors, 'reverseElement');
  const copyForward = () => onReverseChange({ ...reverse, element: { ...forward }, copiedUnconfirmed: true });
  const startEmpty = () =>
    onReverseChange({
      ...reverse,
      element: { ...emptyElementDraft, lengthUnit: forward.lengthUnit },
      copiedUnconfirmed: false,
    });

  return (
    <FormSection title="Flow direction" description={description} testID={`${testPrefix}-direction`}>
      <ChoiceGroup
        label="Flow in both directions (bi-directional)"
        options={[
          { value: 'no', label: 'No' },
          { value: 'yes', label: 'Yes' },
        ]}
        value={bidirectional}
        onChange={onBidirectionalChange}
        testIDPrefix={id('line.bidirectional')}
      />
      {bidirectional === 'no' ? (
        <AppText variant="caption" tone="muted">
          One way only: reverse flow is not counted, and raises the alarm “Reverse flow on a one-way meter run”.
        </AppText>
      ) : (
        <View style={styles.group}>
          <ChoiceGroup
            label="Direction of flow from"
            options={directionOptions}
            value={reverse.directionSource}
            onChange={(directionSource) => onReverseChange({ ...reverse, directionSource })}
            testIDPrefix={id('directionSource')}
          />
          <AppText variant="caption" tone="muted">
            {directionHints[reverse.directionSource]}
          </AppText>
          <AppText variant="bodyStrong">Element in reverse flow</AppText>
          {reverse.element === null ? (
            <>
              <AppText variant="caption" tone={missing ? 'error' : 'muted'} testID={id('reverseElement-error')}>
                {missing ??
                  'The element’s constants in reverse flow: a cone or orifice may differ by direction, and a calibrated element has its own curve of C for each direction.'}
              </AppText>
              <View style={styles.actions}>
                <Button label="Same constants as forward" onPress={copyForward} testID={`${testPrefix}-reverse-copy`} />
                <Button label="Enter reverse constants" onPress={startEmpty} testID={`${testPrefix}-reverse-empty`} />
              </View>
            </>
          ) : (
            <>
              {reverse.copiedUnconfirmed ? (
                <Notice title="Copied from the forward element" testID={`${testPrefix}-reverse-copied`}>
                  {`Check each value against the reverse-flow data sheet or calibration certificate and change what differs, then confirm.${missing ? ` ${missing}` : ''}`}
                </Notice>
              ) : null}
              <ElementFields
                draft={reverse.element}
                onChange={(element) => onReverseChange({ ...reverse, element })}
                errors={errors}
                testPrefix={testPrefix}
                field="reverseElement"
              />
              <View style={styles.actions}>
                {reverse.copiedUnconfirmed ? (
                  <Button
                    label="Confirm reverse constants"
                    variant="primary"
                    onPress={() => onReverseChange({ ...reverse, copiedUnconfirmed: false })}
                    testID={`${testPrefix}-reverse-confirm`}
                  />
                ) : null}
                <Button
                  label="Clear reverse constants"
                  onPress={() => onReverseChange({ ...reverse, element: null, copiedUnconfirmed: false })}
                  testID={`${testPrefix}-reverse-clear`}
                />
              </View>
            </>
          )}
        </View>
      )}
    </FormSection>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
