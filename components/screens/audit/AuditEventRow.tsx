/**
 * One audit event: when, and who did what to which record in words; its change as "field: old → new"
 * lines; the raw JSON only behind the "Details" toggle.
 */
import { useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { colors, radius, space } from '@/constants/theme';
import type { AuditEvent } from '@/hooks/api/auditEvents';
import { AUDIT_KIND_LABELS } from '@/shared/audit/audit-kinds';
import { auditSentence, changedFields } from './auditWords';

function asJson(value: unknown): string {
  if (value === null || value === undefined) return '(none)';
  return JSON.stringify(value, null, 2);
}

const monospace = Platform.select({
  web: 'ui-monospace, SFMono-Regular, Menlo, Consolas, monospace',
  default: 'monospace',
});

/**
 * @param nameOf the actor's name for an e-mail, where the viewer may list users (admins); else the e-mail
 */
export function AuditEventRow({
  event,
  nameOf,
}: {
  event: AuditEvent;
  nameOf?: (email: string) => string | undefined;
}) {
  const [open, setOpen] = useState(false);
  const hasChange = event.before != null || event.after != null;
  const who = event.actorEmail ? (nameOf?.(event.actorEmail) ?? event.actorEmail) : 'The system';
  const changes = event.action.endsWith('.update') ? changedFields(event.before, event.after) : [];
  return (
    <View style={styles.row} testID={`audit-event-${event.id}`}>
      <View style={styles.line}>
        <AppText variant="caption" tone="muted" tabular style={styles.when}>
          {formatTimestamp(event.occurredAt)}
        </AppText>
        <AppText variant="caption" tone="muted" testID={`audit-event-${event.id}-kind`}>
          {AUDIT_KIND_LABELS[event.kind]}
        </AppText>
        <AppText variant="caption" tone="muted" style={styles.entity}>
          {event.action}
        </AppText>
      </View>
      <AppText variant="bodyStrong" testID={`audit-sentence-${event.id}`}>
        {auditSentence(event, who)}
      </AppText>
      {changes.length ? (
        <View style={styles.diff} testID={`audit-diff-${event.id}`}>
          {changes.map((c) => (
            <AppText key={c.field} variant="caption" tabular>{`${c.field}: ${c.before} → ${c.after}`}</AppText>
          ))}
        </View>
      ) : null}
      {event.reason ? <AppText variant="caption">{`Reason: ${event.reason}`}</AppText> : null}
      {hasChange ? (
        <View style={styles.toggle}>
          <Button
            label={open ? 'Hide details' : 'Details'}
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
  diff: { gap: space.xxs, paddingLeft: space.sm, borderLeftWidth: 2, borderLeftColor: colors.divider },
  entity: { flexGrow: 1, minWidth: 120 },
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
