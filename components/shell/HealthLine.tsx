/**
 * One line on the server's health. Normal is stated plainly in grey; only a part that is down
 * gets the alarm colour, with a triangle and the word "down".
 */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { colors, space } from '@/constants/theme';
import { isHealthy, useHealth } from '@/hooks/api/health';

export function HealthLine({ onDark }: { onDark?: boolean }) {
  const health = useHealth();
  const muted = onDark ? 'onDarkMuted' : 'muted';
  if (health.isPending) return null;
  if (health.error || !health.data) {
    return (
      <View style={[styles.row, styles.alarm]} role="alert" testID="health-line">
        <AppText variant="caption" style={styles.alarmText}>
          ⊗ Server not reachable
        </AppText>
      </View>
    );
  }
  if (isHealthy(health.data)) {
    return (
      <View style={styles.row} testID="health-line">
        <AppText variant="caption" tone={muted}>
          Server, database and broker up
        </AppText>
      </View>
    );
  }
  const down = (['database', 'broker'] as const).filter((part) => health.data[part] !== 'up');
  return (
    <View style={[styles.row, styles.alarm]} role="alert" testID="health-line">
      <AppText variant="caption" style={styles.alarmText}>
        {`⊗ ${down.length ? down.map((part) => `${part} down`).join(', ') : `server ${health.data.status}`}`}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.xs },
  alarm: { backgroundColor: colors.errorSurface, paddingHorizontal: space.sm, borderRadius: 4 },
  alarmText: { color: colors.error },
});
