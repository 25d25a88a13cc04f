/** Text in Tallyrun's type scale. Every string on screen goes through this. */
import { StyleSheet, Text, type TextProps } from 'react-native';

import { colors, type as typeScale, type TypeStep } from '@/constants/theme';

export type TextTone = 'default' | 'muted' | 'onDark' | 'onDarkMuted' | 'error';

interface AppTextProps extends TextProps {
  variant?: TypeStep;
  tone?: TextTone;
  /** Digits of equal width, so columns of numbers line up. */
  tabular?: boolean;
}

const toneColor: Record<TextTone, string> = {
  default: colors.text,
  muted: colors.textMuted,
  onDark: colors.textOnDark,
  onDarkMuted: colors.navTextMuted,
  error: colors.error,
};

export function AppText({ variant = 'body', tone = 'default', tabular, style, ...rest }: AppTextProps) {
  return <Text {...rest} style={[typeScale[variant], { color: toneColor[tone] }, tabular && styles.tabular, style]} />;
}

const styles = StyleSheet.create({
  tabular: { fontVariant: ['tabular-nums'] },
});
