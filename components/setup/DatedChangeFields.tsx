/**
 * When a dated setting takes effect (a date and time on the site's clock) and why it changes:
 * the fields every dated change in set-up asks for (site settings, meter-run limits, a re-range).
 */
import { StyleSheet, View } from 'react-native';

import { TextField } from '@/components/ui/TextField';
import { FieldRow } from './FieldRow';

export interface EffectiveOnSiteClock {
  date: string;
  time: string;
}

export interface DatedChangeFieldsProps {
  effective: EffectiveOnSiteClock;
  onEffectiveChange: (update: (current: EffectiveOnSiteClock) => EffectiveOnSiteClock) => void;
  reason: string;
  onReasonChange: (reason: string) => void;
  errors: { effectiveFrom?: string; reason?: string };
  dateLabel: string;
  timeLabel: string;
  reasonHint: string;
  /** Test ids are `<prefix>-effectiveFrom`, `<prefix>-effectiveTime` and `<prefix>-reason`. */
  testIDPrefix: string;
}

export function DatedChangeFields(props: DatedChangeFieldsProps) {
  const { effective, onEffectiveChange, testIDPrefix } = props;
  return (
    <>
      <FieldRow>
        <View style={styles.field}>
          <TextField
            label={props.dateLabel}
            value={effective.date}
            onChangeText={(date) => onEffectiveChange((current) => ({ ...current, date }))}
            error={props.errors.effectiveFrom}
            hint="YYYY-MM-DD on the site’s clock"
            testID={`${testIDPrefix}-effectiveFrom`}
          />
        </View>
        <View style={styles.field}>
          <TextField
            label={props.timeLabel}
            value={effective.time}
            onChangeText={(time) => onEffectiveChange((current) => ({ ...current, time }))}
            hint="HH:MM, 24 h"
            testID={`${testIDPrefix}-effectiveTime`}
          />
        </View>
      </FieldRow>
      <TextField
        label="Reason"
        value={props.reason}
        onChangeText={props.onReasonChange}
        error={props.errors.reason}
        hint={props.reasonHint}
        testID={`${testIDPrefix}-reason`}
      />
    </>
  );
}

const styles = StyleSheet.create({
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
});
