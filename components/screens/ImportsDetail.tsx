/**
 * One import: its progress while it runs (bytes and rows read, from the server's record of
 * committed batches), then the final counts and every rejected line with its number and reason;
 * and the original file as kept, by its SHA-256, to download.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';

import { formatTimestamp } from '@/components/format/formatTimestamp';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { CopyButton } from '@/components/ui/CopyButton';
import { Notice } from '@/components/ui/Notice';
import { ProgressBar } from '@/components/ui/ProgressBar';
import { StateBadge } from '@/components/ui/StateBadge';
import { colors, radius, space } from '@/constants/theme';
import { useDownloadOriginal, type Import } from '@/hooks/api/imports';
import { formatBytes, formatCount } from './ImportsFormat';

/** Rejected lines drawn at first; the rest on request (the server lists up to 1000). */
const firstLinesShown = 100;

const kindLabel: Record<Import['kind'], string> = { readings: 'Readings', 'field-totals': 'Field totals' };

function progressLabel(item: Import): string {
  const share = item.bytesTotal > 0 ? item.bytesRead / item.bytesTotal : null;
  const percent = share === null ? '' : `${Math.round(Math.min(share, 1) * 100)} % · `;
  return `${percent}${formatBytes(item.bytesRead)} of ${formatBytes(item.bytesTotal)} · ${formatCount(item.rowsRead)} rows read`;
}

function Count({ label, value, testID }: { label: string; value: number; testID: string }) {
  return (
    <View style={styles.count}>
      <AppText variant="caption" tone="muted">
        {label}
      </AppText>
      <AppText variant="title" tabular testID={testID}>
        {formatCount(value)}
      </AppText>
    </View>
  );
}

const monospace = Platform.select({
  web: 'ui-monospace, SFMono-Regular, Menlo, Consolas, monospace',
  default: 'monospace',
});

/** The first and last hex digits of a hash: enough to tell files apart by eye. */
const shortHash = (sha256: string) => `${sha256.slice(0, 12)}…${sha256.slice(-8)}`;

/** The kept original: its hash (shortened; the full value is read aloud and copied) and a download. */
function Original({ item }: { item: Import & { sha256: string } }) {
  const download = useDownloadOriginal();
  return (
    <View style={styles.original} testID="import-original">
      <View style={styles.hash}>
        <AppText variant="caption" tone="muted">
          SHA-256
        </AppText>
        <AppText
          tabular
          selectable
          style={styles.hashText}
          testID="import-sha256"
          aria-label={`SHA-256 ${item.sha256}`}
        >
          {shortHash(item.sha256)}
        </AppText>
      </View>
      <View style={styles.originalActions}>
        <CopyButton text={item.sha256} what="SHA-256" testID="import-sha256-copy" />
        <Button
          size="compact"
          label="Download original"
          busy={download.isPending}
          onPress={() => download.mutate(item)}
          testID="import-download-original"
        />
      </View>
      {download.error ? (
        <AppText tone="error" role="alert">
          {download.error.message}
        </AppText>
      ) : null}
    </View>
  );
}

export function ImportsDetail({ item }: { item: Import }) {
  const [showAll, setShowAll] = useState(false);
  const running = item.status === 'running';
  const share = running ? (item.bytesTotal > 0 ? item.bytesRead / item.bytesTotal : null) : 1;
  const lines = showAll ? item.errors : item.errors.slice(0, firstLinesShown);

  return (
    <View style={styles.wrap} testID={`import-detail-${item.id}`}>
      <View style={styles.heading}>
        <AppText variant="bodyStrong">{item.filename || '(unnamed file)'}</AppText>
        <AppText variant="caption" tone="muted">
          {`${kindLabel[item.kind]}${item.uploadedBy ? ` · uploaded by ${item.uploadedBy}` : ''} · started ${formatTimestamp(item.createdAt)}${item.finishedAt ? ` · finished ${formatTimestamp(item.finishedAt)}` : ''}`}
        </AppText>
      </View>
      {item.sha256 ? <Original item={{ ...item, sha256: item.sha256 }} /> : null}

      <AppText variant="label" testID="import-status" aria-live="polite">
        {running ? '… Importing' : item.status === 'done' ? '✓ Finished' : '⊗ Stopped before the end'}
      </AppText>
      <ProgressBar
        share={share}
        label={
          running ? progressLabel(item) : `${formatBytes(item.bytesTotal)} read · ${formatCount(item.rowsRead)} rows`
        }
        testID="import-progress"
      />

      {item.status === 'failed' ? (
        <Notice tone="error" title="The import stopped">
          Rows committed before the stop are kept. The last line listed below says where and why it stopped.
        </Notice>
      ) : null}

      <View style={styles.counts} testID="import-counts">
        <Count label="Rows read" value={item.rowsRead} testID="import-count-read" />
        <Count label="Imported" value={item.rowsImported} testID="import-count-imported" />
        <Count label="Duplicates" value={item.duplicates} testID="import-count-duplicates" />
        <Count label="Rejected" value={item.rejected} testID="import-count-rejected" />
      </View>

      {!running && item.meterRuns?.length ? (
        <View style={styles.touched} testID="import-meter-runs">
          <AppText variant="label">{`Meter run${item.meterRuns.length === 1 ? '' : 's'} this import touched`}</AppText>
          <View style={styles.touchedLinks}>
            {item.meterRuns.map((run) => (
              <Link
                key={run.id}
                href={`/meter-runs/${encodeURIComponent(run.id)}`}
                testID={`import-meter-run-${run.id}`}
                style={styles.touchedLink}
              >
                <AppText style={styles.linkText}>{`${run.tag}: its records and daily totals`}</AppText>
              </Link>
            ))}
          </View>
        </View>
      ) : null}

      {item.rejected > 0 ? (
        <View style={styles.rejected} testID="import-rejected">
          <StateBadge
            priority="medium"
            label={`${formatCount(item.rejected)} line${item.rejected === 1 ? '' : 's'} rejected${running ? ' so far' : ''}${item.errors.length < item.rejected ? ` (the first ${formatCount(item.errors.length)} are listed)` : ''}`}
          />
          <View style={styles.table} role="table" aria-label="Rejected lines">
            <View style={[styles.tableRow, styles.tableHead]} role="row">
              <AppText variant="label" style={styles.lineCell} role="columnheader">
                Line
              </AppText>
              <AppText variant="label" style={styles.reasonCell} role="columnheader">
                Reason
              </AppText>
            </View>
            {lines.map((error, index) => (
              <View
                key={`${error.line}-${index}`}
                style={styles.tableRow}
                role="row"
                testID={`import-error-${error.line}`}
              >
                <AppText tabular style={styles.lineCell} role="cell">
                  {String(error.line)}
                </AppText>
                <AppText style={styles.reasonCell} role="cell" selectable>
                  {error.message}
                </AppText>
              </View>
            ))}
          </View>
          {item.errors.length > firstLinesShown ? (
            <View style={styles.more}>
              <Button
                size="compact"
                label={
                  showAll
                    ? `Show the first ${firstLinesShown}`
                    : `Show all ${formatCount(item.errors.length)} listed lines`
                }
                onPress={() => setShowAll((all) => !all)}
              />
            </View>
          ) : null}
        </View>
      ) : !running ? (
        <AppText tone="muted">No line was rejected.</AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  heading: { gap: space.xxs },
  touched: { gap: space.xs },
  touchedLinks: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  // At least 44 px high: a comfortable touch target on a phone.
  touchedLink: { minHeight: 44, justifyContent: 'center', paddingVertical: space.xs },
  linkText: { textDecorationLine: 'underline' },
  original: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  hash: { gap: space.xxs, flexGrow: 1 },
  hashText: { fontFamily: monospace },
  originalActions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  count: {
    minWidth: 120,
    flexGrow: 1,
    padding: space.sm,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  rejected: { gap: space.sm },
  table: {
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
    backgroundColor: colors.surfaceRaised,
  },
  tableRow: {
    flexDirection: 'row',
    gap: space.md,
    paddingHorizontal: space.sm,
    paddingVertical: space.xs,
    borderTopWidth: 1,
    borderTopColor: colors.divider,
  },
  tableHead: { borderTopWidth: 0, backgroundColor: colors.surface },
  lineCell: { width: 56 },
  reasonCell: { flex: 1 },
  more: { flexDirection: 'row' },
});
