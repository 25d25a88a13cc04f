/**
 * A message block. `alarm` is for something that failed or needs attention (colour, the error
 * mark ⊗ and words together; components/ui/marks.ts); `info` is a neutral note.
 */
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { colors, radius, space } from '@/constants/theme';
import { AppText } from './AppText';

interface NoticeProps {
  tone?: 'info' | 'error';
  title?: string;
  children?: ReactNode;
  testID?: string;
}

export function Notice({ tone = 'info', title, children, testID }: NoticeProps) {
  const alarm = tone === 'error';
  return (
    <View testID={testID} role={alarm ? 'alert' : 'status'} style={[styles.box, alarm ? styles.alarm : styles.info]}>
      <AppText variant="bodyStrong" tone={alarm ? 'error' : 'muted'} aria-hidden style={styles.shape}>
        {alarm ? '⊗' : 'i'}
      </AppText>
      <View style={styles.body}>
        {title ? <AppText variant="bodyStrong">{title}</AppText> : null}
        {typeof children === 'string' ? <AppText>{children}</AppText> : children}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    flexDirection: 'row',
    gap: space.md,
    padding: space.md,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderLeftWidth: 4,
  },
  info: { backgroundColor: colors.surface, borderColor: colors.border, borderLeftColor: colors.borderStrong },
  alarm: { backgroundColor: colors.errorSurface, borderColor: colors.error, borderLeftColor: colors.error },
  shape: { width: 16, textAlign: 'center' },
  body: { flex: 1, gap: space.xs },
});
