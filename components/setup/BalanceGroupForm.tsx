/**
 * A site's balance groups in set-up (issue 10 §3): the groups it has, and a form for a new one
 * with its name, each meter run of the site as inlet, outlet or not in the group (so no run can
 * be on both sides), an allowance for fuel and losses (percent of the inlet, or a fixed daily
 * volume at base conditions in the site's units) and a tolerance in percent of the inlet.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { formatFigure } from '@/components/balance/balanceView';
import { useBalanceGroups, useCreateBalanceGroup, type BalanceGroup } from '@/components/balance/useBalanceGroups';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { QueryState } from '@/components/ui/QueryState';
import { TextField } from '@/components/ui/TextField';
import { colors, radius, space } from '@/constants/theme';
import { unitsFor } from '@/constants/units-display';
import type { MeterRun } from '@/hooks/api/meterRuns';
import type { Site } from '@/hooks/api/sites';
import { fromSI, toSI } from '@/shared/units';
import { FieldRow } from './FieldRow';
import { FormErrorSummary } from './FormErrorSummary';
import { fieldErrorFromServer, fieldTestID, parseNumberText, type FieldErrors } from './formFields';
import { NumberField } from './NumberField';

type Side = 'none' | 'inlet' | 'outlet';
type AllowanceKind = 'percent' | 'daily';

const labels: Record<string, string> = {
  name: 'Name',
  inletMeterRunIds: 'Inlet meter runs',
  outletMeterRunIds: 'Outlet meter runs',
  allowancePercent: 'Allowance',
  allowanceDailyM3: 'Allowance',
  tolerancePercent: 'Tolerance',
  siteId: 'Site',
};

const sideOptions = [
  { value: 'none' as const, label: 'Not in group' },
  { value: 'inlet' as const, label: 'Inlet' },
  { value: 'outlet' as const, label: 'Outlet' },
];

/** One line per group: its sides, allowance and tolerance, the daily allowance in the site's units. */
function describeGroup(group: BalanceGroup, site: Site): string {
  const v = unitsFor(site.displayUnits).standardVolume;
  const tags = (side: 'inlet' | 'outlet') =>
    group.members
      .filter((m) => m.side === side)
      .map((m) => m.tag)
      .join(', ');
  const allowance =
    group.allowancePercent !== null
      ? `${formatFigure(group.allowancePercent, 2)} % of the inlet`
      : `${formatFigure(fromSI(group.allowanceDailyM3 ?? 0, v.unit), 3)} ${v.label} a day`;
  return `In: ${tags('inlet')} · out: ${tags('outlet')} · allowance ${allowance} · tolerance ±${formatFigure(group.tolerancePercent, 2)} %`;
}

export function BalanceGroupForm({ site, meterRuns }: { site: Site; meterRuns: readonly MeterRun[] }) {
  const groups = useBalanceGroups(site.id);
  const create = useCreateBalanceGroup();
  const prefix = 'balance-group';
  const volume = unitsFor(site.displayUnits).standardVolume;
  const [name, setName] = useState('');
  const [sides, setSides] = useState<Record<string, Side>>({});
  const [allowanceKind, setAllowanceKind] = useState<AllowanceKind>('percent');
  const [allowance, setAllowance] = useState('');
  const [tolerance, setTolerance] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [created, setCreated] = useState<string | null>(null);

  const idsOn = (side: Side) => meterRuns.filter((run) => sides[run.id] === side).map((run) => run.id);

  const submit = () => {
    const found: FieldErrors = {};
    const inletMeterRunIds = idsOn('inlet');
    const outletMeterRunIds = idsOn('outlet');
    const allowanceValue = parseNumberText(allowance);
    const toleranceValue = parseNumberText(tolerance);
    const allowanceField = allowanceKind === 'percent' ? 'allowancePercent' : 'allowanceDailyM3';
    if (!name.trim()) found.name = 'is required';
    if (!inletMeterRunIds.length) found.inletMeterRunIds = 'must name at least one meter run';
    if (!outletMeterRunIds.length) found.outletMeterRunIds = 'must name at least one meter run';
    if (allowanceValue === undefined || !Number.isFinite(allowanceValue) || allowanceValue < 0)
      found[allowanceField] = 'must be a number, 0 or more';
    if (toleranceValue === undefined || !Number.isFinite(toleranceValue) || toleranceValue <= 0)
      found.tolerancePercent = 'must be a number above 0';
    setErrors(found);
    setCreated(null);
    if (Object.keys(found).length || allowanceValue === undefined || toleranceValue === undefined) return;
    create.mutate(
      {
        siteId: site.id,
        name: name.trim(),
        inletMeterRunIds,
        outletMeterRunIds,
        // The daily allowance is typed in the site's unit and sent in m³ at base conditions.
        ...(allowanceKind === 'percent'
          ? { allowancePercent: allowanceValue }
          : { allowanceDailyM3: toSI(allowanceValue, volume.unit) }),
        tolerancePercent: toleranceValue,
      },
      {
        onSuccess: (group) => {
          setCreated(group.name);
          setName('');
          setSides({});
          setAllowance('');
          setTolerance('');
        },
      },
    );
  };

  const serverErrors = fieldErrorFromServer(create.error);
  const shown: FieldErrors = { ...serverErrors, ...errors };
  // Both allowance fields are one input on screen.
  const allowanceError = shown.allowancePercent ?? shown.allowanceDailyM3;
  const id = (key: string) => fieldTestID(prefix, key);

  return (
    <View style={styles.form} testID={prefix}>
      <QueryState
        isPending={groups.isPending}
        error={groups.error}
        onRetry={() => void groups.refetch()}
        noun="balance groups"
      />
      {groups.data && groups.data.length === 0 ? (
        <AppText tone="muted">This site has no balance group yet.</AppText>
      ) : null}
      {groups.data?.map((group) => (
        <View key={group.id} style={styles.group} testID={`${prefix}-row-${group.name}`}>
          <AppText variant="bodyStrong">{group.name}</AppText>
          <AppText variant="caption" tone="muted">
            {describeGroup(group, site)}
          </AppText>
        </View>
      ))}
      {created ? <Notice testID={`${prefix}-created`}>{`Balance group ${created} added.`}</Notice> : null}

      <AppText variant="title" role="heading" aria-level={3}>
        Add a balance group
      </AppText>
      <FormErrorSummary
        errors={shown}
        labels={labels}
        general={create.error && !serverErrors ? create.error.message : null}
      />
      <TextField label="Name" value={name} onChangeText={setName} error={shown.name} testID={id('name')} />
      <View style={styles.members}>
        <AppText variant="label">Meter runs</AppText>
        <AppText variant="caption" tone="muted">
          Inlets are what comes into the station, outlets what leaves it; a meter run is on one side at most.
        </AppText>
        {meterRuns.length === 0 ? <AppText tone="muted">This site has no meter runs yet.</AppText> : null}
        {meterRuns.map((run) => (
          <ChoiceGroup
            key={run.id}
            label={`${run.tag} · ${run.name}`}
            options={sideOptions}
            value={sides[run.id] ?? 'none'}
            onChange={(side) => setSides((current) => ({ ...current, [run.id]: side }))}
            testIDPrefix={`${prefix}-side-${run.tag}`}
          />
        ))}
        {shown.inletMeterRunIds ? (
          <AppText tone="error" testID={id('inletMeterRunIds-error')}>
            {`Inlet meter runs: ${shown.inletMeterRunIds}`}
          </AppText>
        ) : null}
        {shown.outletMeterRunIds ? (
          <AppText tone="error" testID={id('outletMeterRunIds-error')}>
            {`Outlet meter runs: ${shown.outletMeterRunIds}`}
          </AppText>
        ) : null}
      </View>
      <ChoiceGroup
        label="Allowance for fuel and losses"
        options={[
          { value: 'percent' as const, label: 'Percent of the inlet' },
          { value: 'daily' as const, label: `Fixed daily volume (${volume.label})` },
        ]}
        value={allowanceKind}
        onChange={setAllowanceKind}
        testIDPrefix={id('allowanceKind')}
      />
      <FieldRow>
        <NumberField
          label={allowanceKind === 'percent' ? 'Allowance (% of the inlet)' : `Allowance (${volume.label} a day)`}
          value={allowance}
          onChangeText={setAllowance}
          error={allowanceError}
          hint={allowanceKind === 'daily' ? 'At the site’s base conditions.' : undefined}
          testID={id('allowance')}
        />
        <NumberField
          label="Tolerance (± % of the inlet)"
          value={tolerance}
          onChangeText={setTolerance}
          error={shown.tolerancePercent}
          testID={id('tolerancePercent')}
        />
      </FieldRow>
      <View style={styles.actions}>
        <Button
          label="Add balance group"
          variant="primary"
          onPress={submit}
          busy={create.isPending}
          testID={`${prefix}-submit`}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  members: { gap: space.sm },
  group: {
    gap: space.xxs,
    padding: space.md,
    backgroundColor: colors.surfaceRaised,
    borderWidth: 1,
    borderColor: colors.divider,
    borderRadius: radius.sm,
  },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
