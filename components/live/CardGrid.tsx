/**
 * Lays cards out in as many equal columns as fit the width it is given (one on a phone, two or
 * three on a wide screen, more on a wall screen), so every card in a row has the same width.
 */
import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

import { space } from '@/constants/theme';

interface CardGridProps {
  /** The narrowest a card may be, in px. */
  minCardWidth: number;
  /** Draws the cards at the width worked out (undefined until the grid has been measured: then full width). */
  children: (cardWidth: number | undefined) => ReactNode;
  testID?: string;
}

const gap = space.md;

export function CardGrid({ minCardWidth, children, testID }: CardGridProps) {
  const [width, setWidth] = useState<number | undefined>(undefined);
  const columns = width === undefined ? 1 : Math.max(1, Math.floor((width + gap) / (minCardWidth + gap)));
  const cardWidth = width === undefined ? undefined : Math.floor((width - gap * (columns - 1)) / columns);
  return (
    <View testID={testID} style={styles.grid} onLayout={(event) => setWidth(event.nativeEvent.layout.width)}>
      {children(cardWidth)}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap },
});
