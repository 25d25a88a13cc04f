/**
 * A button. `primary` is the one main action of a view (dark neutral fill); `secondary` an
 * outlined alternative; `quiet` a low-emphasis text action. None uses colour: emphasis comes
 * from fill and weight, keeping colour free for abnormal states.
 */
import { ActivityIndicator, Pressable, StyleSheet, View } from 'react-native';

import { colors, layout, radius, space } from '@/constants/theme';
import { AppText } from './AppText';
import type { WebPressableState } from '@/components/ui/pressableState';

interface ButtonProps {
  label: string;
  onPress: () => void;
  variant?: 'primary' | 'secondary' | 'quiet';
  size?: 'regular' | 'compact';
  disabled?: boolean;
  /** Shows a spinner and ignores presses while an action runs. */
  busy?: boolean;
  testID?: string;
  accessibilityLabel?: string;
  /** On a dark surface (the navigation), draw the outline light. */
  onDark?: boolean;
}

export function Button({
  label,
  onPress,
  variant = 'secondary',
  size = 'regular',
  disabled,
  busy,
  testID,
  accessibilityLabel,
  onDark,
}: ButtonProps) {
  const inactive = disabled || busy;
  const textTone = variant === 'primary' || onDark ? 'onDark' : 'default';
  return (
    <Pressable
      testID={testID}
      role="button"
      aria-label={accessibilityLabel ?? label}
      aria-disabled={inactive || undefined}
      aria-busy={busy || undefined}
      disabled={inactive}
      onPress={onPress}
      style={({ pressed, hovered, focused }: WebPressableState) => [
        styles.base,
        size === 'compact' && styles.compact,
        variant === 'primary' && styles.primary,
        variant === 'primary' && (pressed || hovered) && styles.primaryPressed,
        variant === 'secondary' && styles.secondary,
        variant === 'secondary' && onDark && styles.secondaryOnDark,
        variant === 'secondary' && !onDark && (pressed || hovered) && styles.secondaryPressed,
        variant === 'quiet' && styles.quiet,
        variant === 'quiet' && (pressed || hovered) && styles.quietPressed,
        focused && styles.focused,
        inactive && styles.inactive,
      ]}
    >
      <View style={styles.content}>
        {busy ? (
          <ActivityIndicator size="small" color={variant === 'primary' ? colors.actionText : colors.text} />
        ) : null}
        <AppText
          variant={size === 'compact' ? 'label' : 'bodyStrong'}
          tone={textTone}
          numberOfLines={1}
          style={variant === 'quiet' && styles.quietText}
        >
          {label}
        </AppText>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  // Every size keeps a finger-sized target (44 × 44 px, WCAG 2.5.5); compact only trims the padding.
  base: {
    minHeight: layout.touchTarget,
    minWidth: layout.touchTarget,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: 'transparent',
    alignItems: 'center',
    justifyContent: 'center',
  },
  compact: { paddingHorizontal: space.md },
  content: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  primary: { backgroundColor: colors.actionFill, borderColor: colors.actionFill },
  primaryPressed: { backgroundColor: colors.actionFillPressed },
  secondary: { backgroundColor: colors.surfaceRaised, borderColor: colors.borderStrong },
  secondaryOnDark: { backgroundColor: 'transparent', borderColor: colors.navTextMuted },
  secondaryPressed: { backgroundColor: colors.surfaceSunken },
  quiet: { backgroundColor: 'transparent', paddingHorizontal: space.sm },
  quietPressed: { backgroundColor: colors.surfaceSunken },
  quietText: { textDecorationLine: 'underline' },
  focused: { outlineColor: colors.focusRing, outlineStyle: 'solid', outlineWidth: 2, outlineOffset: 2 },
  inactive: { opacity: 0.5 },
});
