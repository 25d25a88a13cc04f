/**
 * A meter run's configuration versions, newest first, each with the moment it took effect on
 * the site's clock, its element and fluid, the reason given, who made it, and field by field
 * what it changed from the version before it (an auditor traces a figure to these). The one in
 * force is marked.
 */
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { colors, radius, space } from '@/constants/theme';
import type { ConfigVersion } from '@/hooks/api/meterRuns';
import { describeFieldChange } from './configChangeText';
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
            <AppText variant="caption">{`Reason: ${version.reason || '—'}`}</AppText>
            <AppText variant="caption" tone="muted" testID={`version-row-${version.id}-author`}>
              {`By ${version.createdBy ? `${version.createdBy.name} (${version.createdBy.email})` : 'an unrecorded user'} · recorded ${formatTimestamp(version.createdAt)}`}
            </AppText>
            <Changes version={version} />
          </View>
        );
      })}
    </View>
  );
}

/** What the version changed, one field a line: the path as the API names it, then before → after. */
function Changes({ version }: { version: ConfigVersion }) {
  if (version.first)
    return (
      <AppText variant="caption" tone="muted">
        First version: the meter run's history starts here.
      </AppText>
    );
  if (!version.changes) return null;
  if (!version.changes.length)
    return (
      <AppText variant="caption" tone="muted">
        No field changed from the version before.
      </AppText>
    );
  return (
    <View style={styles.changes} testID={`version-row-${version.id}-changes`}>
      <AppText variant="label">{`Changed from the version before (${version.changes.length}):`}</AppText>
      {version.changes.map((change) => {
        const { path, text } = describeFieldChange(change);
        return (
          <View key={path} style={styles.change}>
            <AppText variant="caption" tone="muted" style={styles.changePath}>
              {path}
            </AppText>
            <AppText variant="caption" tabular style={styles.changeText}>
              {text}
            </AppText>
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
  changes: {
    gap: space.xxs,
    marginTop: space.xs,
    paddingTop: space.xs,
    borderTopWidth: 1,
    borderTopColor: colors.divider,
  },
  // Path and values share a line when there is room and wrap under each other on a phone.
  change: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.sm },
  changePath: { flexShrink: 1 },
  changeText: { flexShrink: 1 },
});
