/** One audit event: when, who, what was done to which record, and on request the change itself. */
import { useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { colors, radius, space } from '@/constants/theme';
import type { AuditEvent } from '@/hooks/api/auditEvents';
import { AUDIT_KIND_LABELS } from '@/shared/audit/audit-kinds';

function asJson(value: unknown): string {
  if (value === null || value === undefined) return '(none)';
  return JSON.stringify(value, null, 2);
}

const monospace = Platform.select({
  web: 'ui-monospace, SFMono-Regular, Menlo, Consolas, monospace',
  default: 'monospace',
});

export function AuditEventRow({ event }: { event: AuditEvent }) {
  const [open, setOpen] = useState(false);
  const hasChange = event.before != null || event.after != null;
  return (
    <View style={styles.row} testID={`audit-event-${event.id}`}>
      <View style={styles.line}>
        <AppText variant="caption" tone="muted" tabular style={styles.when}>
          {formatTimestamp(event.occurredAt)}
        </AppText>
        <AppText variant="bodyStrong" style={styles.what}>
          {event.action}
        </AppText>
        <AppText variant="caption" tone="muted" testID={`audit-event-${event.id}-kind`}>
          {AUDIT_KIND_LABELS[event.kind]}
        </AppText>
        <AppText tone="muted" style={styles.entity}>
          {event.entityId ? `${event.entityType} ${event.entityId}` : event.entityType}
        </AppText>
        <AppText variant="label" style={styles.who}>
          {event.actorEmail ?? 'system'}
        </AppText>
      </View>
      {event.reason ? <AppText variant="caption">{`Reason: ${event.reason}`}</AppText> : null}
      {hasChange ? (
        <View style={styles.toggle}>
          <Button
            label={open ? 'Hide change' : 'Show change'}
            size="compact"
            variant="quiet"
            onPress={() => setOpen(!open)}
          />
        </View>
      ) : null}
      {open ? (
        <View style={styles.change}>
          <View style={styles.side}>
            <AppText variant="label">Before</AppText>
            <AppText variant="caption" selectable style={styles.code}>
              {asJson(event.before)}
            </AppText>
          </View>
          <View style={styles.side}>
            <AppText variant="label">After</AppText>
            <AppText variant="caption" selectable style={styles.code}>
              {asJson(event.after)}
            </AppText>
          </View>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.divider, gap: space.xs },
  line: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.md, rowGap: space.xxs },
  when: { minWidth: 190 },
  what: { minWidth: 140 },
  entity: { flexGrow: 1, minWidth: 120 },
  who: {},
  toggle: { flexDirection: 'row' },
  change: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  side: { flexGrow: 1, flexBasis: 260, gap: space.xs },
  code: {
    fontFamily: monospace,
    padding: space.sm,
    backgroundColor: colors.surfaceSunken,
    borderRadius: radius.sm,
    ...(Platform.OS === 'web' ? { whiteSpace: 'pre-wrap' } : null),
  } as object,
});
