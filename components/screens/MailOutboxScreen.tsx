/** The mail outbox (admin): every mail the server sent, as the local SMTP stand-in captured it. */
import { useState } from 'react';
import { Platform, Pressable, StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { mailRuleWords, unmailedAlarmsWords } from '@/components/format/mailRuleWords';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { colors, radius, space } from '@/constants/theme';
import { useAlarmCounts } from '@/hooks/api/alarms';
import { useMail, type Mail } from '@/hooks/api/mail';
import { useUsers } from '@/hooks/api/users';

/** When Tallyrun mails, to whom, and why unacknowledged alarms may have sent nothing. */
function MailRulePanel() {
  const users = useUsers();
  const counts = useAlarmCounts();
  if (!users.data) return null;
  const engineers = users.data.filter((u) => u.role === 'engineer' && !u.disabled).length;
  const why = counts.data ? unmailedAlarmsWords(counts.data.unacknowledgedByPriority, engineers) : null;
  return (
    <Panel title="When mail is sent" testID="mail-rule">
      <AppText>{mailRuleWords(engineers)}</AppText>
      {why ? (
        <AppText tone="muted" testID="mail-rule-unmailed">
          {why}
        </AppText>
      ) : null}
    </Panel>
  );
}

function MailRow({ mail }: { mail: Mail }) {
  const [open, setOpen] = useState(false);
  return (
    <View style={styles.row} testID={`mail-${mail.id}`}>
      <Pressable role="button" aria-expanded={open} onPress={() => setOpen(!open)} style={styles.summary}>
        <AppText variant="bodyStrong" style={styles.subject}>
          {`${open ? '▾' : '▸'} ${mail.subject}`}
        </AppText>
        <AppText tone="muted">{`To ${mail.to}`}</AppText>
        <AppText variant="caption" tone="muted" tabular>
          {formatTimestamp(mail.sentAt)}
        </AppText>
      </Pressable>
      {open ? (
        <AppText selectable style={styles.text}>
          {mail.text || '(no text part)'}
        </AppText>
      ) : null}
    </View>
  );
}

export function MailOutboxScreen() {
  const mail = useMail();
  const list = mail.data ?? [];
  return (
    <Screen lead="Alarm notices, month-end messages and other mail Tallyrun sent. On this installation mail is captured here rather than delivered.">
      <MailRulePanel />
      <Panel
        title={mail.data ? `Messages (${list.length})` : 'Messages'}
        actions={
          <Button
            label="Refresh"
            size="compact"
            busy={mail.isFetching && !mail.isPending}
            onPress={() => void mail.refetch()}
          />
        }
        testID="mail-list"
      >
        <QueryState
          isPending={mail.isPending}
          error={mail.error}
          onRetry={() => void mail.refetch()}
          noun="the outbox"
        />
        {mail.data && list.length === 0 ? <AppText tone="muted">No mail has been sent yet.</AppText> : null}
        {list.map((item) => (
          <MailRow key={item.id} mail={item} />
        ))}
      </Panel>
    </Screen>
  );
}

const styles = StyleSheet.create({
  row: { borderBottomWidth: 1, borderBottomColor: colors.divider, paddingVertical: space.sm, gap: space.sm },
  summary: { gap: space.xxs },
  subject: {},
  text: {
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.divider,
    ...(Platform.OS === 'web' ? { whiteSpace: 'pre-wrap' } : null),
  } as object,
});
