/**
 * Tallyrun's wordmark with a small drawn mark: an orifice plate in a pipe, in section (two
 * pipe walls, the plate narrowing the bore between them). Drawn with views, so no image asset.
 */
import { StyleSheet, View } from 'react-native';

import { colors, space } from '@/constants/theme';
import { AppText } from '@/components/ui/AppText';

interface BrandMarkProps {
  onDark?: boolean;
  size?: 'regular' | 'large';
}

/** Mark geometry on a 22 px square, scaled for the large size. */
const mark = { size: 22, wall: 2, plate: 3, boreTop: 8, boreBottom: 14 } as const;

export function BrandMark({ onDark, size = 'regular' }: BrandMarkProps) {
  const ink = onDark ? colors.textOnDark : colors.text;
  const k = size === 'large' ? 1.4 : 1;
  const plateLeft = ((mark.size - mark.plate) / 2) * k;
  return (
    <View style={styles.row} aria-label="Tallyrun" role="img">
      <View style={{ width: mark.size * k, height: mark.size * k }}>
        <View style={[styles.bar, { backgroundColor: ink, top: 2 * k, left: 0, right: 0, height: mark.wall * k }]} />
        <View style={[styles.bar, { backgroundColor: ink, bottom: 2 * k, left: 0, right: 0, height: mark.wall * k }]} />
        <View
          style={[
            styles.bar,
            {
              backgroundColor: ink,
              top: 2 * k,
              left: plateLeft,
              width: mark.plate * k,
              height: (mark.boreTop - 2) * k,
            },
          ]}
        />
        <View
          style={[
            styles.bar,
            {
              backgroundColor: ink,
              top: mark.boreBottom * k,
              left: plateLeft,
              width: mark.plate * k,
              height: (mark.size - 2 - mark.boreBottom) * k,
            },
          ]}
        />
      </View>
      <AppText variant={size === 'large' ? 'display' : 'title'} tone={onDark ? 'onDark' : 'default'} aria-hidden>
        Tallyrun
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  bar: { position: 'absolute' },
});
