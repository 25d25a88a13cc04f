/** A placeholder for an area that a later issue builds: says what will be here and for whom. */
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';
import { Panel } from '@/components/ui/Panel';
import { Screen } from '@/components/ui/Screen';
import type { AreaKey } from '@/constants/areas';
import { space } from '@/constants/theme';
import { useSignedInUser } from '@/hooks/session/SessionProvider';
import { actionLinesFor, upcomingAreas } from './upcomingAreas';

interface UpcomingScreenProps {
  area: AreaKey;
  /** Replaces the area's lead, e.g. for one meter run. */
  lead?: string;
}

export function UpcomingScreen({ area, lead }: UpcomingScreenProps) {
  const user = useSignedInUser();
  const text = upcomingAreas[area];
  const actions = text ? actionLinesFor(text, user.role) : [];
  return (
    <Screen testID={`screen-${area}`}>
      <Panel title="Coming in a later release">
        <AppText>{lead ?? text?.lead ?? ''}</AppText>
        {actions.length ? (
          <View style={styles.actions}>
            {actions.map((line) => (
              <AppText key={line} tone="muted">{`• ${line}`}</AppText>
            ))}
          </View>
        ) : null}
      </Panel>
      {text?.caution ? <Notice title="Safety">{text.caution}</Notice> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  actions: { gap: space.xs },
});
