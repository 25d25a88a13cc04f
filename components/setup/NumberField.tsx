/**
 * A labelled number input with, optionally, the unit it is typed in chosen beside it (mm or in,
 * kPa or psi). The field keeps the text as typed; the form converts it to SI on submit.
 */
import { Pressable, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { TextField } from '@/components/ui/TextField';
import { colors, layout, radius, space } from '@/constants/theme';

interface NumberFieldProps<U extends string> {
  label: string;
  value: string;
  onChangeText: (text: string) => void;
  error?: string;
  hint?: string;
  testID?: string;
  /** The units it may be typed in; with one, the unit is only named. */
  units?: readonly { value: U; label: string }[];
  unit?: U;
  onChangeUnit?: (unit: U) => void;
  editable?: boolean;
  /** Narrower, for a grid of many small fields (a gas composition). */
  compact?: boolean;
}

export function NumberField<U extends string>({
  label,
  value,
  onChangeText,
  error,
  hint,
  testID,
  units,
  unit,
  onChangeUnit,
  editable,
  compact,
}: NumberFieldProps<U>) {
  const unitLabel = units?.find((option) => option.value === unit)?.label;
  return (
    <View style={[styles.wrap, compact && styles.compact]}>
      <TextField
        label={unitLabel ? `${label} (${unitLabel})` : label}
        value={value}
        onChangeText={onChangeText}
        error={error}
        hint={hint}
        testID={testID}
        inputMode="decimal"
        autoCorrect={false}
        autoComplete="off"
        editable={editable}
      />
      {units && units.length > 1 && onChangeUnit ? (
        <View style={styles.units} role="radiogroup" aria-label={`Unit of ${label}`}>
          {units.map((option) => {
            const selected = option.value === unit;
            return (
              <Pressable
                key={option.value}
                role="radio"
                aria-checked={selected}
                onPress={() => onChangeUnit(option.value)}
                testID={testID ? `${testID}-unit-${option.value}` : undefined}
                style={[styles.unit, selected && styles.unitSelected]}
              >
                <AppText variant="caption" tone={selected ? 'onDark' : 'default'}>
                  {selected ? `✓ ${option.label}` : option.label}
                </AppText>
              </Pressable>
            );
          })}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  // Sized for a FieldRow (a wrapping row): two or three to a line when wide, one on a phone.
  wrap: { gap: space.xs, flexGrow: 1, flexBasis: 200, minWidth: 160 },
  compact: { flexBasis: 140, minWidth: 120 },
  units: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  // A finger-sized target (44 × 44 px, WCAG 2.5.5) however short the unit's name.
  unit: {
    minHeight: layout.touchTarget,
    minWidth: layout.touchTarget,
    alignItems: 'center',
    paddingHorizontal: space.sm,
    justifyContent: 'center',
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    backgroundColor: colors.surfaceRaised,
  },
  unitSelected: { backgroundColor: colors.actionFill, borderColor: colors.actionFill },
});
