/**
 * A meter run's event log: changes of its configuration and constants, newest recorded first,
 * each with when it takes effect and was recorded, who made it, why, and old → new per
 * field. Roles that read the audit log see every audited change of the run (its settings,
 * transmitters, alarm limits, corrections); the others see the configuration versions.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { can } from '@/constants/roles';
import { colors, space } from '@/constants/theme';
import { useAuditEvents } from '@/hooks/api/auditEvents';
import { useConfigVersions } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { useSignedInUser } from '@/hooks/session/SessionProvider';
import { formatInstant } from '@/shared/format/time';
import { buildEventLog, valueInWords, type EventLogEntry } from './eventLog';

/** Entries shown before "Show all". */
const shortList = 10;
/** Audit events read for the log: far more than a meter run's set-up changes in years. */
const auditLimit = 1000;

/** Fields shown before "Show all fields": a creation lists every field as new, which would bury the log. */
const fewFields = 4;

function Entry({ entry, timeZone, index }: { entry: EventLogEntry; timeZone: string; index: number }) {
  const [open, setOpen] = useState(false);
  const changes = open ? entry.changes : entry.changes.slice(0, fewFields);
  const at = (iso: string) => formatInstant(iso, timeZone);
  const backDated = at(entry.recordedAt) !== at(entry.effectiveAt);
  return (
    <View style={styles.entry} testID={`event-log-entry-${index}`}>
      <View style={styles.line}>
        <AppText variant="bodyStrong" tabular>
          {at(entry.recordedAt)}
        </AppText>
        <AppText variant="bodyStrong">{entry.what}</AppText>
        <AppText variant="caption" tone="muted">
          {entry.kindLabel}
        </AppText>
      </View>
      <AppText variant="caption" tone="muted">
        {`${entry.who}${backDated ? ` · effective from ${at(entry.effectiveAt)}` : ''}`}
      </AppText>
      {entry.reason ? <AppText variant="caption">{`Why: ${entry.reason}`}</AppText> : null}
      {changes.map((change) => (
        <View key={change.path} style={styles.change}>
          <AppText variant="caption" style={styles.path}>
            {change.path}
          </AppText>
          <AppText variant="caption" tabular style={styles.values}>
            {`${valueInWords(change.before)} → ${valueInWords(change.after)}`}
          </AppText>
        </View>
      ))}
      {entry.changes.length > fewFields ? (
        <View style={styles.more}>
          <Button
            label={open ? 'Show fewer fields' : `Show all ${entry.changes.length} fields`}
            size="compact"
            variant="quiet"
            onPress={() => setOpen(!open)}
            testID={`event-log-entry-${index}-fields`}
          />
        </View>
      ) : null}
    </View>
  );
}

export function EventLogPanel({ meterRunId, site }: { meterRunId: string; site: Site }) {
  const user = useSignedInUser();
  const readsAudit = can(user.role, 'readAuditLog');
  const versions = useConfigVersions(meterRunId);
  const events = useAuditEvents(auditLimit, { meterRunId }, readsAudit);
  const [all, setAll] = useState(false);
  const entries = versions.data ? buildEventLog(versions.data, events.data ?? []) : [];
  const shown = all ? entries : entries.slice(0, shortList);

  return (
    <Panel
      title="Event log"
      testID="event-log"
      actions={
        <Button
          label="Refresh"
          size="compact"
          busy={(versions.isFetching && !versions.isPending) || (events.isFetching && !events.isPending)}
          onPress={() => {
            void versions.refetch();
            if (readsAudit) void events.refetch();
          }}
        />
      }
    >
      <QueryState
        isPending={versions.isPending}
        error={versions.error}
        onRetry={() => void versions.refetch()}
        noun="the configuration history"
      />
      {readsAudit ? (
        <QueryState
          isPending={events.isPending}
          error={events.error}
          onRetry={() => void events.refetch()}
          noun="the audit events"
        />
      ) : null}
      {versions.data && entries.length === 0 ? <AppText tone="muted">No changes recorded.</AppText> : null}
      {shown.map((entry, index) => (
        <Entry key={entry.key} entry={entry} timeZone={site.timeZone} index={index} />
      ))}
      {entries.length > shortList ? (
        <Button
          label={all ? 'Show fewer' : `Show all ${entries.length}`}
          size="compact"
          variant="quiet"
          onPress={() => setAll(!all)}
          testID="event-log-all"
        />
      ) : null}
      <AppText variant="caption" tone="muted">
        {readsAudit
          ? "Configuration versions and every audited change of this meter run and its transmitters, newest recorded first, each with the time it takes effect from when that differs. Old → new per field. Times on the site's clock."
          : "Configuration versions, newest recorded first, each with the time it takes effect from when that differs. Old → new per field. Times on the site's clock. Other changes are in the audit log (engineers, accountants, administrators)."}
      </AppText>
    </Panel>
  );
}

const styles = StyleSheet.create({
  entry: { paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.divider, gap: space.xxs },
  line: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.md },
  change: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.sm, paddingLeft: space.md },
  path: { minWidth: 180, flexShrink: 1 },
  more: { flexDirection: 'row' },
  values: { flexShrink: 1 },
});
