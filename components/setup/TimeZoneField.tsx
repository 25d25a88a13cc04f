/**
 * The site's time zone: typed freely, with the IANA zones the text can mean offered underneath
 * ("Chicago" offers America/Chicago); choosing one fills the field. The schema still checks
 * whatever is left in it.
 */
import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { TextField } from '@/components/ui/TextField';
import { space } from '@/constants/theme';
import { allTimeZones, timeZoneMatches } from './timeZones';

interface TimeZoneFieldProps {
  value: string;
  onChangeText: (text: string) => void;
  error?: string;
  testID: string;
}

export function TimeZoneField({ value, onChangeText, error, testID }: TimeZoneFieldProps) {
  const zones = useMemo(() => allTimeZones(), []);
  const known = zones.includes(value.trim());
  const matches = known ? [] : timeZoneMatches(value, zones, 6);
  return (
    <View style={styles.wrap}>
      <TextField
        label="Time zone"
        value={value}
        onChangeText={onChangeText}
        error={error}
        hint="IANA name, e.g. America/Denver: type a city and choose. Contract days follow its daylight-saving rules."
        testID={testID}
        autoCapitalize="none"
        autoCorrect={false}
        autoComplete="off"
      />
      {matches.length ? (
        <View style={styles.matches} role="list" aria-label="Time zones matching what is typed">
          <AppText variant="caption" tone="muted">
            Choose:
          </AppText>
          {matches.map((zone) => (
            <View key={zone} role="listitem">
              <Button
                label={zone}
                size="compact"
                onPress={() => onChangeText(zone)}
                testID={`${testID}-option-${zone.replace(/\//g, '-')}`}
              />
            </View>
          ))}
        </View>
      ) : null}
      {value.trim() !== '' && !known && matches.length === 0 ? (
        <AppText variant="caption" tone="muted" testID={`${testID}-nomatch`}>
          No IANA time zone has this in its name: try the largest city in the zone.
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  matches: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.xs },
});
