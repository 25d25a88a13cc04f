/**
 * The audit log's filters: meter run (by site, then run), user (typed, then picked), kind and
 * period. On a phone they fold into one line that says what is shown, so the events come first.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Panel } from '@/components/ui/Panel';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import type { AuditFilters as Filters } from '@/hooks/api/auditEvents';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import type { AuditKind } from '@/shared/audit/audit-kinds';
import {
  describeAuditFilters,
  kindChoices,
  matchingActors,
  periodChoices,
  type PeriodChoice,
  type PeriodPreset,
} from './auditFilterParams';

/** The filters the screen holds: what the server is asked for, less the period, which is chosen as a preset or dates. */
export type AuditScreenFilters = Pick<Filters, 'meterRunId' | 'userId' | 'kind'>;

interface AuditFiltersProps {
  filters: AuditScreenFilters;
  period: PeriodChoice;
  periodError?: { field: 'fromDate' | 'toDate'; message: string };
  sites: readonly Site[];
  meterRuns: readonly MeterRun[];
  actors: readonly { id: string; email: string }[];
  onChange: (filters: AuditScreenFilters) => void;
  onPeriodChange: (period: PeriodChoice) => void;
  /** Start folded (phones). */
  folded: boolean;
}

export function AuditFilters(props: AuditFiltersProps) {
  const { filters, period, periodError, sites, meterRuns, actors, onChange, onPeriodChange } = props;
  const [folded, setFolded] = useState(props.folded);
  const chosenRun = filters.meterRunId ? meterRuns.find((run) => run.id === filters.meterRunId) : undefined;
  const [siteId, setSiteId] = useState(chosenRun?.siteId ?? '');
  const [userText, setUserText] = useState('');
  const chosenUser = filters.userId ? actors.find((a) => a.id === filters.userId) : undefined;
  const summary = describeAuditFilters(filters, period, { meterRunTag: chosenRun?.tag, userEmail: chosenUser?.email });

  if (folded) {
    return (
      <View style={styles.folded} testID="audit-filters">
        <AppText style={styles.summary} testID="audit-filters-summary">{`Showing: ${summary}`}</AppText>
        <Button label="Filter" size="compact" onPress={() => setFolded(false)} testID="audit-filters-open" />
      </View>
    );
  }

  const siteOptions = [{ value: '', label: 'All sites' }, ...sites.map((s) => ({ value: s.id, label: s.code }))];
  const runOptions = [
    { value: '', label: 'All meter runs' },
    ...meterRuns.filter((run) => run.siteId === siteId).map((run) => ({ value: run.id, label: run.tag })),
  ];
  const matches = matchingActors(actors, userText);

  return (
    <Panel
      title="Filter"
      testID="audit-filters"
      actions={
        props.folded ? (
          <Button label="Done" size="compact" onPress={() => setFolded(true)} testID="audit-filters-close" />
        ) : undefined
      }
    >
      <ChoiceGroup
        label="Site"
        options={siteOptions}
        value={siteId}
        onChange={(next) => {
          setSiteId(next);
          onChange({ ...filters, meterRunId: undefined });
        }}
        testIDPrefix="audit-filter-site"
      />
      {siteId ? (
        <ChoiceGroup
          label="Meter run"
          options={runOptions}
          value={filters.meterRunId ?? ''}
          onChange={(meterRunId) => onChange({ ...filters, meterRunId: meterRunId || undefined })}
          testIDPrefix="audit-filter-meter-run"
        />
      ) : filters.meterRunId ? (
        <View style={styles.chosen}>
          <AppText>{`Meter run ${chosenRun?.tag ?? filters.meterRunId}`}</AppText>
          <Button
            label="All meter runs"
            size="compact"
            variant="quiet"
            onPress={() => onChange({ ...filters, meterRunId: undefined })}
            testID="audit-filter-meter-run-clear"
          />
        </View>
      ) : null}
      {filters.userId ? (
        <View style={styles.chosen}>
          <AppText testID="audit-filter-user-chosen">{`User ${chosenUser?.email ?? filters.userId}`}</AppText>
          <Button
            label="Anyone"
            size="compact"
            variant="quiet"
            onPress={() => onChange({ ...filters, userId: undefined })}
            testID="audit-filter-user-clear"
          />
        </View>
      ) : (
        <View style={styles.user}>
          <TextField
            label="User"
            value={userText}
            onChangeText={setUserText}
            placeholder="Type part of an email"
            autoCapitalize="none"
            autoCorrect={false}
            hint={userText.trim() && matches.length === 0 ? 'Nobody with that email has acted.' : undefined}
            testID="audit-filter-user"
          />
          {matches.map((actor) => (
            <Button
              key={actor.id}
              label={actor.email}
              size="compact"
              variant="secondary"
              onPress={() => {
                setUserText('');
                onChange({ ...filters, userId: actor.id });
              }}
              testID={`audit-filter-user-${actor.id}`}
            />
          ))}
        </View>
      )}
      <ChoiceGroup
        label="Kind"
        options={kindChoices}
        value={filters.kind ?? ''}
        onChange={(kind) => onChange({ ...filters, kind: (kind || undefined) as AuditKind | undefined })}
        testIDPrefix="audit-filter-kind"
      />
      <ChoiceGroup
        label="Period"
        options={periodChoices}
        value={period.preset}
        onChange={(preset: PeriodPreset) => onPeriodChange({ ...period, preset })}
        testIDPrefix="audit-filter-period"
      />
      {period.preset === 'custom' ? (
        <View style={styles.dates}>
          <View style={styles.date}>
            <TextField
              label="From (date)"
              value={period.fromDate ?? ''}
              onChangeText={(fromDate) => onPeriodChange({ ...period, fromDate })}
              placeholder="YYYY-MM-DD"
              error={periodError?.field === 'fromDate' ? periodError.message : undefined}
              testID="audit-filter-from"
            />
          </View>
          <View style={styles.date}>
            <TextField
              label="To (date, included)"
              value={period.toDate ?? ''}
              onChangeText={(toDate) => onPeriodChange({ ...period, toDate })}
              placeholder="YYYY-MM-DD"
              error={periodError?.field === 'toDate' ? periodError.message : undefined}
              testID="audit-filter-to"
            />
          </View>
        </View>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  folded: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  summary: { flex: 1 },
  chosen: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
  user: { gap: space.xs, alignItems: 'flex-start' },
  dates: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  date: { flexGrow: 1, flexBasis: 160 },
});
