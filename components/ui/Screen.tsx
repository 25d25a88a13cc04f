/**
 * The scrolling body of a signed-in screen: a centred column no wider than is comfortable to
 * read, with an optional lead paragraph under the header's area title.
 */
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { layout, space } from '@/constants/theme';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { AppText } from './AppText';

interface ScreenProps {
  /** One or two sentences on what this screen is for. */
  lead?: string;
  children?: ReactNode;
  testID?: string;
}

export function Screen({ lead, children, testID }: ScreenProps) {
  const breakpoint = useBreakpoint();
  return (
    <ScrollView
      testID={testID}
      style={styles.scroll}
      contentContainerStyle={[styles.content, breakpoint !== 'phone' && styles.contentWide]}
      keyboardShouldPersistTaps="handled"
    >
      <View style={styles.column}>
        {lead ? (
          <AppText tone="muted" style={styles.lead}>
            {lead}
          </AppText>
        ) : null}
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1 },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  contentWide: { padding: space.xl },
  column: { width: '100%', maxWidth: layout.contentMaxWidth, alignSelf: 'center', gap: space.lg },
  lead: { maxWidth: 720 },
});
