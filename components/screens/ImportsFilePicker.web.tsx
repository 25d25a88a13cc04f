/**
 * Web: picks a CSV with the browser's own file chooser (a hidden <input type="file">) opened
 * by a button, and names the chosen file and its size.
 */
import { useRef } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { space } from '@/constants/theme';
import type { ImportsFilePickerProps } from './ImportsFilePicker.types';
import { formatBytes } from './ImportsFormat';

export function ImportsFilePicker({ file, onChange, disabled }: ImportsFilePickerProps) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <View style={styles.row}>
      <input
        ref={input}
        type="file"
        accept=".csv,text/csv,text/plain"
        data-testid="import-file-input"
        aria-label="CSV file"
        style={{ display: 'none' }}
        onChange={(event) => {
          const chosen = event.currentTarget.files?.[0];
          onChange(chosen ? { name: chosen.name, blob: chosen } : null);
          // Choosing the same file again after an upload should fire change again.
          event.currentTarget.value = '';
        }}
      />
      <Button
        label={file ? 'Choose another file…' : 'Choose a CSV file…'}
        onPress={() => input.current?.click()}
        disabled={disabled}
        testID="import-choose"
      />
      <AppText tone={file ? 'default' : 'muted'} testID="import-chosen" style={styles.name}>
        {file ? `${file.name} (${formatBytes(file.blob.size)})` : 'No file chosen'}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  name: { flexShrink: 1 },
});
