/** A titled part of a long form; optionally folded away until asked for. */
import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { colors, space } from '@/constants/theme';

interface FormSectionProps {
  title: string;
  description?: string;
  children: ReactNode;
  /** Start folded, with a button to open it (for optional parts). */
  folded?: boolean;
  testID?: string;
}

export function FormSection({ title, description, children, folded = false, testID }: FormSectionProps) {
  const [open, setOpen] = useState(!folded);
  return (
    <View style={styles.section} testID={testID}>
      <View style={styles.heading}>
        <AppText variant="bodyStrong" role="heading" aria-level={3} style={styles.title}>
          {title}
        </AppText>
        {folded ? (
          <Button
            size="compact"
            variant="quiet"
            label={open ? 'Hide' : 'Show'}
            onPress={() => setOpen((value) => !value)}
            testID={testID ? `${testID}-toggle` : undefined}
          />
        ) : null}
      </View>
      {description && open ? (
        <AppText variant="caption" tone="muted">
          {description}
        </AppText>
      ) : null}
      {open ? children : null}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: space.md, borderTopWidth: 1, borderTopColor: colors.divider, paddingTop: space.md },
  heading: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  title: { flex: 1 },
});
