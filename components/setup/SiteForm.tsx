/**
 * A site: code, name, time zone, contract hour, base conditions and atmospheric pressure, and
 * the units its screens show. Pressures and temperatures are typed in the unit chosen beside
 * them and sent in SI; the draft is checked with the server's own siteSchema before sending.
 * Editing, the contract hour, base conditions and atmospheric pressure are dated settings: a
 * change takes effect from a time on the site's clock (default now), with a reason.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { ChoiceGroup } from '@/components/ui/ChoiceGroup';
import { Notice } from '@/components/ui/Notice';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { useCreateSite, useUpdateSite, type Site } from '@/hooks/api/sites';
import { siteSchema } from '@/shared/schemas/setup';
import { DatedChangeFields } from './DatedChangeFields';
import { FieldRow } from './FieldRow';
import { FormErrorSummary } from './FormErrorSummary';
import { fieldErrorFromServer, fieldErrorsFromZod, fieldTestID, parseNumberText, type FieldErrors } from './formFields';
import { NumberField } from './NumberField';
import { TimeZoneField } from './TimeZoneField';
import { useReveal } from './useReveal';
import { siteClockNow, zonedIso } from './zonedTime';
import {
  absolutePressureUnits,
  convertShown,
  fromSI,
  roundedText,
  siFromShown,
  temperatureUnits,
  type ShownValue,
  type AbsolutePressureUnit,
  type TemperatureUnit,
} from './unitChoices';

interface SiteDraft {
  code: string;
  name: string;
  timeZone: string;
  contractHour: string;
  basePressure: string;
  basePressureUnit: AbsolutePressureUnit;
  baseTemperature: string;
  baseTemperatureUnit: TemperatureUnit;
  atmosphericPressure: string;
  atmosphericPressureUnit: AbsolutePressureUnit;
  displayUnits: 'si' | 'us';
  /** The SI values behind numbers the form converted and rounded for reading (kept while the text is unchanged). */
  shown: Partial<Record<ValueField, ShownValue>>;
}

type ValueField = 'basePressure' | 'baseTemperature' | 'atmosphericPressure';

const labels: Record<string, string> = {
  code: 'Code',
  name: 'Name',
  timeZone: 'Time zone',
  contractHour: 'Contract hour',
  basePressurePa: 'Base pressure',
  baseTemperatureK: 'Base temperature',
  atmosphericPressurePa: 'Atmospheric pressure',
  displayUnits: 'Units on screen',
};

const displayUnitOptions = [
  { value: 'si' as const, label: 'SI (kPa, °C, m³, t)' },
  { value: 'us' as const, label: 'US customary (psi, °F, Mscf)' },
];

function browserTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
}

/** A new site starts at the ISO 13443 standard reference conditions, 15 °C and 101.325 kPa (common practice). */
function emptyDraft(): SiteDraft {
  return {
    code: '',
    name: '',
    timeZone: browserTimeZone(),
    contractHour: '6',
    basePressure: '101.325',
    basePressureUnit: 'kPa',
    baseTemperature: '15',
    baseTemperatureUnit: 'degC',
    atmosphericPressure: '101.325',
    atmosphericPressureUnit: 'kPa',
    displayUnits: 'si',
    shown: {},
  };
}

function draftFromSite(site: Site): SiteDraft {
  const us = site.displayUnits === 'us';
  const pressureUnit: AbsolutePressureUnit = us ? 'psi' : 'kPa';
  const temperatureUnit: TemperatureUnit = us ? 'degF' : 'degC';
  const stored = (si: number, unit: AbsolutePressureUnit | TemperatureUnit): ShownValue => ({
    text: roundedText(fromSI(si, unit), unit),
    si,
  });
  const basePressure = stored(site.basePressurePa, pressureUnit);
  const baseTemperature = stored(site.baseTemperatureK, temperatureUnit);
  const atmosphericPressure = stored(site.atmosphericPressurePa, pressureUnit);
  return {
    code: site.code,
    name: site.name,
    timeZone: site.timeZone,
    contractHour: String(site.contractHour),
    basePressure: basePressure.text,
    basePressureUnit: pressureUnit,
    baseTemperature: baseTemperature.text,
    baseTemperatureUnit: temperatureUnit,
    atmosphericPressure: atmosphericPressure.text,
    atmosphericPressureUnit: pressureUnit,
    displayUnits: site.displayUnits,
    shown: { basePressure, baseTemperature, atmosphericPressure },
  };
}

function bodyFrom(draft: SiteDraft) {
  return {
    code: draft.code,
    name: draft.name,
    timeZone: draft.timeZone.trim(),
    contractHour: parseNumberText(draft.contractHour),
    basePressurePa: siFromShown(draft.basePressure, draft.basePressureUnit, draft.shown.basePressure),
    baseTemperatureK: siFromShown(draft.baseTemperature, draft.baseTemperatureUnit, draft.shown.baseTemperature),
    atmosphericPressurePa: siFromShown(
      draft.atmosphericPressure,
      draft.atmosphericPressureUnit,
      draft.shown.atmosphericPressure,
    ),
    displayUnits: draft.displayUnits,
  };
}

interface SiteFormProps {
  /** The site to edit; a new site when absent. */
  site?: Site;
  onDone?: (site: Site) => void;
  onCancel?: () => void;
}

export function SiteForm({ site, onDone, onCancel }: SiteFormProps) {
  const create = useCreateSite();
  const update = useUpdateSite();
  const mutation = site ? update : create;
  const prefix = site ? 'site-edit' : 'site-create';
  const [draft, setDraft] = useState<SiteDraft>(() => (site ? draftFromSite(site) : emptyDraft()));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState<{ text: string; site: Site } | null>(null);
  const [attempt, setAttempt] = useState(0);
  const savedRef = useReveal(saved);
  const [effective, setEffective] = useState(() => siteClockNow(site?.timeZone ?? 'UTC', Date.now()));
  const [reason, setReason] = useState('');
  const datedChanged = site ? datedSettingsDiffer(site, bodyFrom(draft)) : false;

  const edit = <K extends keyof SiteDraft>(key: K, value: SiteDraft[K]) => {
    setDraft((current) => ({ ...current, [key]: value }));
    setSaved(null);
    if (mutation.error) mutation.reset();
  };

  /** A new unit for a value field: the quantity stays the same, shown rounded for reading (see convertShown). */
  const changeUnit = <V extends ValueField>(field: V, unit: SiteDraft[`${V}Unit`]) => {
    setDraft((current) => withUnit(current, field, unit));
  };

  /** US customary units on screen: the base conditions are shown in psia and °F too (SI: kPa and °C). */
  const changeDisplayUnits = (displayUnits: SiteDraft['displayUnits']) => {
    const pressure: AbsolutePressureUnit = displayUnits === 'us' ? 'psi' : 'kPa';
    const temperature: TemperatureUnit = displayUnits === 'us' ? 'degF' : 'degC';
    setDraft((current) => {
      const withPressure = withUnit(current, 'basePressure', pressure);
      const withTemperature = withUnit(withPressure, 'baseTemperature', temperature);
      return { ...withUnit(withTemperature, 'atmosphericPressure', pressure), displayUnits };
    });
    setSaved(null);
  };

  const submit = () => {
    setAttempt((count) => count + 1);
    const body = bodyFrom(draft);
    const parsed = siteSchema.safeParse(body);
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    const onSuccess = (result: Site) => {
      setSaved({ text: site ? `Saved ${result.code}.` : `Added ${result.code} · ${result.name}.`, site: result });
      if (!site) setDraft(emptyDraft());
      onDone?.(result);
    };
    if (site) {
      // The code names the site in every MQTT topic: it stays as it was created.
      const { code: _code, ...change } = parsed.data;
      const dated = datedChanged
        ? { effectiveFrom: zonedIso(effective.date, effective.time, site.timeZone), reason: reason.trim() || undefined }
        : {};
      update.mutate({ id: site.id, change: { ...change, ...dated } }, { onSuccess });
    } else {
      create.mutate(parsed.data, { onSuccess });
    }
  };

  const serverErrors = fieldErrorFromServer(mutation.error);
  const shown: FieldErrors = { ...serverErrors, ...errors };
  const general = mutation.error && !serverErrors ? mutation.error.message : null;
  const id = (key: string) => fieldTestID(prefix, key);

  return (
    <View style={styles.form} testID={prefix}>
      {saved ? (
        <View ref={savedRef} aria-live="polite">
          <Notice testID={`${prefix}-done`}>
            <AppText>{saved.text}</AppText>
            {site ? null : (
              <Link href={`/setup?site=${encodeURIComponent(saved.site.id)}`} testID={`${prefix}-done-open`}>
                <AppText style={styles.link}>{`Open ${saved.site.code} to add its meter runs`}</AppText>
              </Link>
            )}
          </Notice>
        </View>
      ) : null}
      <FormErrorSummary
        errors={shown}
        labels={labels}
        general={general}
        testID={`${prefix}-errors`}
        fieldPrefix={prefix}
        revealKey={attempt}
      />
      <FieldRow>
        <View style={styles.field}>
          <TextField
            label="Code"
            value={draft.code}
            onChangeText={(text) => edit('code', text)}
            error={shown.code}
            hint={
              site
                ? 'Part of every MQTT topic of the site: it cannot be changed.'
                : 'Short, e.g. KFG. It becomes part of MQTT topics.'
            }
            testID={id('code')}
            autoCapitalize="characters"
            autoCorrect={false}
            editable={!site}
          />
        </View>
        <View style={styles.field}>
          <TextField
            label="Name"
            value={draft.name}
            onChangeText={(text) => edit('name', text)}
            error={shown.name}
            testID={id('name')}
          />
        </View>
      </FieldRow>
      <FieldRow>
        <View style={styles.field}>
          <TimeZoneField
            value={draft.timeZone}
            onChangeText={(text) => edit('timeZone', text)}
            error={shown.timeZone}
            testID={id('timeZone')}
          />
        </View>
        <NumberField
          label="Contract hour"
          value={draft.contractHour}
          onChangeText={(text) => edit('contractHour', text)}
          error={shown.contractHour}
          hint="0–23, local time: when the contract day starts."
          testID={id('contractHour')}
        />
      </FieldRow>
      <FieldRow>
        <NumberField
          label="Base pressure"
          value={draft.basePressure}
          onChangeText={(text) => edit('basePressure', text)}
          units={absolutePressureUnits}
          unit={draft.basePressureUnit}
          onChangeUnit={(unit) => changeUnit('basePressure', unit)}
          error={shown.basePressurePa}
          testID={id('basePressurePa')}
        />
        <NumberField
          label="Base temperature"
          value={draft.baseTemperature}
          onChangeText={(text) => edit('baseTemperature', text)}
          units={temperatureUnits}
          unit={draft.baseTemperatureUnit}
          onChangeUnit={(unit) => changeUnit('baseTemperature', unit)}
          error={shown.baseTemperatureK}
          testID={id('baseTemperatureK')}
        />
        <NumberField
          label="Atmospheric pressure"
          value={draft.atmosphericPressure}
          onChangeText={(text) => edit('atmosphericPressure', text)}
          units={absolutePressureUnits}
          unit={draft.atmosphericPressureUnit}
          onChangeUnit={(unit) => changeUnit('atmosphericPressure', unit)}
          error={shown.atmosphericPressurePa}
          hint="Local, for gauge transmitters (lower at altitude)."
          testID={id('atmosphericPressurePa')}
        />
      </FieldRow>
      {datedChanged && site ? (
        <>
          <DatedChangeFields
            effective={effective}
            onEffectiveChange={setEffective}
            reason={reason}
            onReasonChange={setReason}
            errors={shown}
            dateLabel={`Effective date (${site.timeZone})`}
            timeLabel="Effective time"
            reasonHint="Why the setting changes. It goes into the audit trail."
            testIDPrefix={prefix}
          />
          <Notice title="Dated settings">
            The contract hour, base conditions and atmospheric pressure take effect from the time above: the site’s
            meter runs are recomputed from then on, and hours before it keep the settings then in force. A new contract
            hour starts at the next contract-day start; the day that spans the change is longer or shorter.
          </Notice>
        </>
      ) : null}
      <ChoiceGroup
        label="Units on screen"
        options={displayUnitOptions}
        value={draft.displayUnits}
        onChange={changeDisplayUnits}
        testIDPrefix={id('displayUnits')}
      />
      <View style={styles.actions}>
        <Button
          label={site ? 'Save site' : 'Add site'}
          variant="primary"
          onPress={submit}
          busy={mutation.isPending}
          testID={`${prefix}-submit`}
        />
        {onCancel ? <Button label="Cancel" variant="quiet" onPress={onCancel} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md },
  field: { flexGrow: 1, flexBasis: 200, minWidth: 160 },
  actions: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  link: { textDecorationLine: 'underline' },
});

/** The draft with one value field in a new unit, converted once and rounded for reading. */
function withUnit<V extends ValueField>(draft: SiteDraft, field: V, unit: SiteDraft[`${V}Unit`]): SiteDraft {
  const from = draft[`${field}Unit`];
  if (from === unit) return draft;
  const converted = convertShown(draft[field], from, unit, draft.shown[field]);
  return {
    ...draft,
    [`${field}Unit`]: unit,
    [field]: converted.text,
    shown: { ...draft.shown, [field]: converted.shown },
  };
}

/** Whether the draft changes a dated setting (a unit round trip's last-digit noise is not a change). */
function datedSettingsDiffer(site: Site, body: ReturnType<typeof bodyFrom>): boolean {
  const differs = (a: number | undefined, b: number) =>
    a !== undefined && Number.isFinite(a) && Math.abs(a - b) > 1e-12 * Math.max(Math.abs(a), Math.abs(b));
  return (
    differs(body.contractHour, site.contractHour) ||
    differs(body.basePressurePa, site.basePressurePa) ||
    differs(body.baseTemperatureK, site.baseTemperatureK) ||
    differs(body.atmosphericPressurePa, site.atmosphericPressurePa)
  );
}
