/**
 * The dated settings of a meter run (issue 9), newest first: its hold limit, gap limit, no-flow
 * cutoff and stacked-pair shares, its transmitters' ranges and accuracies, and its site's contract
 * hour, base conditions and atmospheric pressure. Each version shows when it took effect on the
 * site's clock, what it is about, the reason, who made it and field by field what it changed, so
 * an auditor can trace any hour's figures to the settings in force then.
 */
import { StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { colors, radius, space } from '@/constants/theme';
import { useSettingVersions, type MeterRun, type SettingVersion } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { describeFieldChange } from './configChangeText';
import { formatOnSiteClock } from './zonedTime';

/** What a version is about, in words. */
function subjectOf(version: SettingVersion, site: Site): string {
  if (version.kind === 'meter-run') return `Meter run ${version.subject.tag ?? version.subject.id} limits`;
  if (version.kind === 'transmitter') return `Transmitter ${version.subject.tag ?? version.subject.id} range`;
  return `Site ${site.code} settings`;
}

export function SettingVersionsPanel({ run, site }: { run: MeterRun; site: Site }) {
  const versions = useSettingVersions(run.id);
  const newestFirst = [...(versions.data ?? [])].sort(
    (a, b) =>
      Date.parse(b.effectiveFrom) - Date.parse(a.effectiveFrom) || Date.parse(b.createdAt) - Date.parse(a.createdAt),
  );
  return (
    <Panel title="Dated settings" testID="setting-versions">
      <AppText variant="caption" tone="muted">
        Limits, transmitter ranges and site settings in force at each moment. A change takes effect from its time on;
        hours before it keep the settings then in force.
      </AppText>
      <QueryState
        isPending={versions.isPending}
        error={versions.error}
        onRetry={() => void versions.refetch()}
        noun="dated settings"
      />
      <View style={styles.list}>
        {newestFirst.map((version) => (
          <View
            key={`${version.kind}-${version.id}`}
            style={styles.row}
            testID={`setting-row-${version.kind}-${version.id}`}
          >
            <AppText variant="bodyStrong" tabular>
              {`From ${formatOnSiteClock(version.effectiveFrom, site.timeZone)} · ${subjectOf(version, site)}`}
            </AppText>
            <AppText variant="caption">{`Reason: ${version.reason || '—'}`}</AppText>
            <AppText variant="caption" tone="muted">
              {`By ${version.createdBy ? `${version.createdBy.name} (${version.createdBy.email})` : 'an unrecorded user'} · recorded ${formatTimestamp(version.createdAt)}`}
            </AppText>
            {version.first ? (
              <AppText variant="caption" tone="muted">
                First version: in force from the start of history.
              </AppText>
            ) : (
              version.changes.map((change) => {
                const { path, text } = describeFieldChange(change);
                return (
                  <View key={path} style={styles.change}>
                    <AppText variant="caption" tone="muted">
                      {path}
                    </AppText>
                    <AppText variant="caption" tabular>
                      {text}
                    </AppText>
                  </View>
                );
              })
            )}
          </View>
        ))}
      </View>
    </Panel>
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
  change: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.sm },
});
