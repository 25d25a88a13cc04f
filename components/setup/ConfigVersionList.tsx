/**
 * A meter run's configuration versions, newest first, each with the moment it took effect on
 * the site's clock, its element and fluid, and the reason given. The one in force is marked.
 */
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { colors, radius, space } from '@/constants/theme';
import type { ConfigVersion } from '@/hooks/api/meterRuns';
import { describeElement } from './elementDraft';
import { describeFluid } from './fluidDraft';
import type { LengthUnit } from './unitChoices';
import { formatOnSiteClock } from './zonedTime';

interface ConfigVersionListProps {
  versions: ConfigVersion[];
  currentId: string | undefined;
  timeZone: string;
  lengthUnit: LengthUnit;
}

export function ConfigVersionList({ versions, currentId, timeZone, lengthUnit }: ConfigVersionListProps) {
  const newestFirst = [...versions].sort((a, b) => Date.parse(b.effectiveFrom) - Date.parse(a.effectiveFrom));
  return (
    <View style={styles.list}>
      {newestFirst.map((version) => {
        const current = version.id === currentId;
        const future = Date.parse(version.effectiveFrom) > Date.now();
        return (
          <View
            key={version.id}
            style={[styles.row, current && styles.rowCurrent]}
            testID={`version-row-${version.id}`}
          >
            <View style={styles.title}>
              <AppText
                variant="bodyStrong"
                tabular
              >{`From ${formatOnSiteClock(version.effectiveFrom, timeZone)}`}</AppText>
              {current ? (
                <AppText variant="label">● In force</AppText>
              ) : future ? (
                <AppText variant="label">○ Takes effect later</AppText>
              ) : null}
            </View>
            <AppText variant="caption">{`${describeElement(version.element, lengthUnit)} · ${describeFluid(version.fluid)}`}</AppText>
            <AppText
              variant="caption"
              tone="muted"
            >{`Reason: ${version.reason ?? '—'} · recorded ${formatTimestamp(version.createdAt)}`}</AppText>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xs },
  row: {
    gap: space.xxs,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  rowCurrent: { borderColor: colors.borderStrong, borderLeftWidth: 4 },
  title: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'baseline' },
});
