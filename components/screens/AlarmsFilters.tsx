/**
 * The alarm list's filters: state (open by default), priority, site and meter run. On a phone
 * they fold into one line that says what is shown, so the alarms come first.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Panel } from '@/components/ui/Panel';
import { space } from '@/constants/theme';
import type { AlarmFilters } from '@/hooks/api/alarms';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { describeFilters, priorityChoices, stateChoices } from './alarmFilterParams';

export { describeFilters, stateChoices };

interface AlarmsFiltersProps {
  filters: AlarmFilters;
  sites: readonly Site[];
  meterRuns: readonly MeterRun[];
  onChange: (filters: AlarmFilters) => void;
  /** Start folded (phones). */
  folded: boolean;
}

export function AlarmsFilters({ filters, sites, meterRuns, onChange, folded: startFolded }: AlarmsFiltersProps) {
  const [folded, setFolded] = useState(startFolded);
  const siteOptions = [
    { value: '', label: 'All sites' },
    ...sites.map((site) => ({ value: site.id, label: site.code })),
  ];
  const inSite = filters.siteId ? meterRuns.filter((run) => run.siteId === filters.siteId) : [];
  const runOptions = [
    { value: '', label: 'All meter runs' },
    ...inSite.map((run) => ({ value: run.id, label: run.tag })),
  ];
  // A meter run given by the address whose site's list is not shown still reads as chosen.
  const chosenRun = filters.meterRunId ? meterRuns.find((run) => run.id === filters.meterRunId) : undefined;

  if (folded) {
    return (
      <View style={styles.folded} testID="alarm-filters">
        <AppText
          style={styles.summary}
          testID="alarm-filters-summary"
        >{`Showing: ${describeFilters(filters, sites, meterRuns)}`}</AppText>
        <Button label="Filter" size="compact" onPress={() => setFolded(false)} testID="alarm-filters-open" />
      </View>
    );
  }
  return (
    <Panel
      title="Filter"
      testID="alarm-filters"
      actions={
        startFolded ? (
          <Button label="Done" size="compact" onPress={() => setFolded(true)} testID="alarm-filters-close" />
        ) : undefined
      }
    >
      <ChoiceGroup
        label="State"
        options={stateChoices}
        value={filters.state}
        onChange={(state) => onChange({ ...filters, state })}
        testIDPrefix="alarm-filter-state"
      />
      <ChoiceGroup
        label="Priority"
        options={priorityChoices}
        value={filters.priority ?? ''}
        onChange={(priority) => onChange({ ...filters, priority: priority === '' ? undefined : priority })}
        testIDPrefix="alarm-filter-priority"
      />
      <ChoiceGroup
        label="Site"
        options={siteOptions}
        value={filters.siteId ?? ''}
        onChange={(siteId) =>
          onChange({ ...filters, siteId: siteId === '' ? undefined : siteId, meterRunId: undefined })
        }
        testIDPrefix="alarm-filter-site"
      />
      {filters.siteId ? (
        <ChoiceGroup
          label="Meter run"
          options={runOptions}
          value={filters.meterRunId ?? ''}
          onChange={(meterRunId) => onChange({ ...filters, meterRunId: meterRunId === '' ? undefined : meterRunId })}
          testIDPrefix="alarm-filter-meter-run"
        />
      ) : chosenRun || filters.meterRunId ? (
        <View style={styles.chosen}>
          <AppText>{`Meter run ${chosenRun?.tag ?? filters.meterRunId}`}</AppText>
          <Button
            label="All meter runs"
            size="compact"
            variant="quiet"
            onPress={() => onChange({ ...filters, meterRunId: undefined })}
            testID="alarm-filter-meter-run-clear"
          />
        </View>
      ) : null}
    </Panel>
  );
}

const styles = StyleSheet.create({
  folded: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  summary: { flex: 1 },
  chosen: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
});
