/** The audit log (engineer, accountant, admin, read only): the newest changes, newest first. */
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { defaultAuditLimit, useAuditEvents } from '@/hooks/api/auditEvents';
import { AuditEventRow } from './audit/AuditEventRow';

export function AuditLogScreen() {
  const events = useAuditEvents(defaultAuditLimit);
  const list = events.data ?? [];
  return (
    <Screen lead="Every change to set-up, readings, corrections, periods and users, with who made it and when: the trail to show an auditor. Read only.">
      <Panel
        title={events.data ? `Latest events (${list.length})` : 'Latest events'}
        actions={
          <Button
            label="Refresh"
            size="compact"
            busy={events.isFetching && !events.isPending}
            onPress={() => void events.refetch()}
          />
        }
        testID="audit-list"
      >
        <QueryState
          isPending={events.isPending}
          error={events.error}
          onRetry={() => void events.refetch()}
          noun="the audit log"
        />
        {events.data && list.length === 0 ? <AppText tone="muted">Nothing has been recorded yet.</AppText> : null}
        {list.map((event) => (
          <AuditEventRow key={event.id} event={event} />
        ))}
      </Panel>
    </Screen>
  );
}
