/**
 * The month's close: its status (open, or closed when and by whom), and for accountants and
 * administrators a close that first lists what is not final (hours missing or provisional,
 * corrections awaiting approval, month-end alarms still open) and asks to confirm.
 * Without the periods API on the server it says so and offers no close.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { space } from '@/constants/theme';
import { useClosePeriod, usePeriod } from '@/hooks/api/monthlyVolumes';
import { formatInstant } from '@/shared/format/time';

const count = (list: unknown[] | undefined, one: string, many: string) =>
  list?.length ? `${list.length} ${list.length === 1 ? one : many}` : null;

export function MonthClosePanel({
  siteId,
  month,
  canClose,
  timeZone,
}: {
  siteId: string;
  month: string;
  canClose: boolean;
  /** The site's zone, for when the month was closed (the viewer's when absent). */
  timeZone?: string;
}) {
  const period = usePeriod(siteId, month);
  const close = useClosePeriod();
  const [confirming, setConfirming] = useState(false);
  const p = period.data;
  const incomplete = p?.incomplete;
  const notFinal = [
    count(
      incomplete?.hours,
      'meter run with hours missing or provisional',
      'meter runs with hours missing or provisional',
    ),
    count(incomplete?.corrections, 'correction awaiting approval', 'corrections awaiting approval'),
    count(incomplete?.alarms, 'month-end alarm still open', 'month-end alarms still open'),
  ].filter((line): line is string => line !== null);

  return (
    <Panel title="Month close" testID="month-close">
      <QueryState
        isPending={period.isPending}
        error={period.error}
        onRetry={() => void period.refetch()}
        noun="period"
      />
      {p === null ? (
        <AppText tone="muted" testID="month-close-unavailable">
          This server does not offer closing months yet.
        </AppText>
      ) : null}
      {p ? (
        <AppText testID="month-close-status">
          {p.status === 'closed'
            ? `Closed${p.closedAt ? ` on ${formatInstant(p.closedAt, timeZone)}` : ''}${p.closedBy ? ` by ${p.closedBy.email}` : ''}. Its totals no longer change; late data waits as pending.`
            : 'Open: totals may still change as data arrives or corrections are approved.'}
        </AppText>
      ) : null}
      {p && p.status === 'open' && canClose && !confirming ? (
        <Button label="Close the month…" onPress={() => setConfirming(true)} testID="month-close-start" />
      ) : null}
      {p && p.status === 'open' && canClose && confirming ? (
        <View style={styles.confirm}>
          {notFinal.length ? (
            <Notice tone="error" title="Not final yet" testID="month-close-not-final">
              {notFinal.map((line) => (
                <AppText key={line}>{`• ${line}`}</AppText>
              ))}
            </Notice>
          ) : (
            <AppText>Everything in the month is final.</AppText>
          )}
          <AppText>Once closed, the month's totals stay as they are until an administrator reopens it.</AppText>
          <View style={styles.buttons}>
            <Button
              label={notFinal.length ? 'Close it anyway' : 'Close the month'}
              variant="primary"
              busy={close.isPending}
              onPress={() => close.mutate({ siteId, month, confirm: true }, { onSuccess: () => setConfirming(false) })}
              testID="month-close-confirm"
            />
            <Button label="Cancel" variant="quiet" onPress={() => setConfirming(false)} />
          </View>
        </View>
      ) : null}
      {close.error ? (
        <AppText tone="error" testID="month-close-error">
          {close.error.message}
        </AppText>
      ) : null}
      {p && !canClose ? (
        <AppText variant="caption" tone="muted">
          Closing a month is for accountants and administrators.
        </AppText>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  confirm: { gap: space.sm },
  buttons: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
});
