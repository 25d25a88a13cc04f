/**
 * A row of mutually exclusive choices (a radio group), e.g. a user's role. The chosen one is
 * marked by fill, weight and a check mark, not by colour.
 */
import { Pressable, StyleSheet, View } from 'react-native';

import { colors, layout, radius, space } from '@/constants/theme';
import { AppText } from './AppText';
import type { WebPressableState } from '@/components/ui/pressableState';

interface ChoiceGroupProps<T extends string> {
  label: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
  disabled?: boolean;
  /** Each option gets `${testIDPrefix}-${value}`. */
  testIDPrefix?: string;
}

export function ChoiceGroup<T extends string>({
  label,
  options,
  value,
  onChange,
  disabled,
  testIDPrefix,
}: ChoiceGroupProps<T>) {
  return (
    <View style={styles.group}>
      <AppText variant="label">{label}</AppText>
      <View role="radiogroup" aria-label={label} style={styles.options}>
        {options.map((option) => {
          const selected = option.value === value;
          return (
            <Pressable
              key={option.value}
              testID={testIDPrefix ? `${testIDPrefix}-${option.value}` : undefined}
              role="radio"
              aria-checked={selected}
              aria-disabled={disabled || undefined}
              disabled={disabled}
              onPress={() => onChange(option.value)}
              style={({ focused }: WebPressableState) => [
                styles.option,
                selected && styles.optionSelected,
                focused && styles.focused,
                disabled && styles.disabled,
              ]}
            >
              <AppText variant={selected ? 'bodyStrong' : 'body'} tone={selected ? 'onDark' : 'default'}>
                {selected ? `✓ ${option.label}` : option.label}
              </AppText>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  // A finger-sized target (44 × 44 px, WCAG 2.5.5).
  option: {
    minHeight: layout.touchTarget,
    minWidth: layout.touchTarget,
    alignItems: 'center',
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    backgroundColor: colors.surfaceRaised,
  },
  optionSelected: { backgroundColor: colors.actionFill, borderColor: colors.actionFill },
  focused: { outlineColor: colors.focusRing, outlineStyle: 'solid', outlineWidth: 2, outlineOffset: 2 },
  disabled: { opacity: 0.5 },
});
