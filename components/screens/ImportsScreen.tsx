/**
 * Imports (engineer, admin): upload a CSV of readings or field totals, follow its progress,
 * then read the counts and every rejected line; the readings re-sent with another value
 * (conflicts) to resolve; the latest imports below.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { QueryState } from '@/components/ui/QueryState';
import { Screen } from '@/components/ui/Screen';
import { space } from '@/constants/theme';
import { useImport, useImports, useStartImport, type ImportFile, type ImportKind } from '@/hooks/api/imports';
import { useBreakpoint } from '@/hooks/useBreakpoint';
import { ImportsColumns } from './ImportsColumns';
import { ImportsConflicts } from './ImportsConflicts';
import { ImportsDetail } from './ImportsDetail';
import { ImportsFilePicker } from './ImportsFilePicker';
import { ImportsRecent } from './ImportsRecent';

const kindOptions = [
  { value: 'readings' as const, label: 'Readings' },
  { value: 'field-totals' as const, label: 'Field totals' },
];

export function ImportsScreen() {
  const wide = useBreakpoint() === 'wide';
  const [kind, setKind] = useState<ImportKind>('readings');
  const [file, setFile] = useState<ImportFile | null>(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  // The explanation folds away once a file is sent, so the import's progress shows right below.
  const [showColumns, setShowColumns] = useState(true);
  const start = useStartImport();
  const imports = useImports();
  const selected = useImport(selectedId);

  const upload = () => {
    if (!file || start.isPending) return;
    start.mutate(
      { file, kind },
      {
        onSuccess: (started) => {
          setSelectedId(started.id);
          setFile(null);
          setShowColumns(false);
        },
      },
    );
  };

  const uploadPanel = (
    <Panel title="Upload a CSV" testID="import-upload">
      <ChoiceGroup
        label="What the file holds"
        options={kindOptions}
        value={kind}
        onChange={(next) => {
          setKind(next);
          setShowColumns(true);
          start.reset();
        }}
        testIDPrefix="import-kind"
      />
      {showColumns ? <ImportsColumns kind={kind} /> : null}
      <View style={styles.actions}>
        <Button
          size="compact"
          variant="quiet"
          label={showColumns ? 'Hide the columns expected' : 'Show the columns expected'}
          onPress={() => setShowColumns((shown) => !shown)}
          testID="import-columns-toggle"
        />
      </View>
      <ImportsFilePicker
        file={file}
        onChange={(next) => {
          setFile(next);
          start.reset();
        }}
        disabled={start.isPending}
      />
      {start.error ? (
        <Notice tone="error" title="The upload was refused" testID="import-upload-error">
          {start.error.message}
        </Notice>
      ) : null}
      <View style={styles.actions}>
        <Button
          label={start.isPending ? 'Uploading…' : 'Upload and import'}
          variant="primary"
          onPress={upload}
          disabled={!file}
          busy={start.isPending}
          testID="import-submit"
        />
      </View>
    </Panel>
  );

  const detailPanel = selectedId ? (
    <Panel title="Import" testID="import-current">
      <QueryState
        isPending={selected.isPending}
        error={selected.error}
        onRetry={() => void selected.refetch()}
        noun="the import"
      />
      {selected.data ? <ImportsDetail item={selected.data} /> : null}
    </Panel>
  ) : null;

  const conflictsPanel = (
    <Panel title="Conflicting readings" testID="import-conflicts">
      <ImportsConflicts />
    </Panel>
  );

  const recentPanel = (
    <Panel
      title="Recent imports"
      actions={
        <Button
          label="Refresh"
          size="compact"
          busy={imports.isFetching && !imports.isPending}
          onPress={() => void imports.refetch()}
        />
      }
      testID="import-recent"
      style={wide && styles.recentWide}
    >
      <QueryState
        isPending={imports.isPending}
        error={imports.error}
        onRetry={() => void imports.refetch()}
        noun="imports"
      />
      {imports.data ? <ImportsRecent imports={imports.data} selectedId={selectedId} onSelect={setSelectedId} /> : null}
    </Panel>
  );

  return (
    <Screen lead="Bring in readings recorded elsewhere (a logger, a spreadsheet, a gap in the live feed) or the field device’s own totals for reconciliation. Readings are checked row by row against each transmitter; hours they touch are recomputed.">
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.mainWide}>
            {uploadPanel}
            {detailPanel}
            {conflictsPanel}
          </View>
          {recentPanel}
        </View>
      ) : (
        <>
          {uploadPanel}
          {detailPanel}
          {conflictsPanel}
          {recentPanel}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  mainWide: { flex: 3, gap: space.lg, minWidth: 0 },
  recentWide: { flex: 2, minWidth: 300 },
  actions: { flexDirection: 'row' },
});
