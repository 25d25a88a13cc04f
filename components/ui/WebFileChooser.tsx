/**
 * Web only (imported by `*.web.tsx` pickers): a file chosen with the browser's own chooser (a
 * hidden <input type="file">) opened by a button, with the chosen file's name and size beside it.
 * The imports screen and the calibration form each give their own types, words and test ids.
 */
import { useRef } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { formatBytes } from '@/components/screens/ImportsFormat';
import { space } from '@/constants/theme';

export interface ChosenFile {
  name: string;
  blob: Blob;
}

export interface WebFileChooserProps {
  file: ChosenFile | null;
  onChange: (file: ChosenFile | null) => void;
  disabled?: boolean;
  /** The input's accept list, e.g. ".csv,text/csv". */
  accept: string;
  /** Accessible name of the hidden input. */
  inputLabel: string;
  /** Button words before and after a file is chosen. */
  chooseLabel: string;
  chooseAgainLabel: string;
  /** Shown while nothing is chosen. */
  emptyText: string;
  /** Test ids are `<prefix>-file-input`, `<prefix>-choose` and `<prefix>-chosen`. */
  testIDPrefix: string;
}

export function WebFileChooser(props: WebFileChooserProps) {
  const { file, onChange, disabled, testIDPrefix } = props;
  const input = useRef<HTMLInputElement>(null);
  return (
    <View style={styles.row}>
      <input
        ref={input}
        type="file"
        accept={props.accept}
        data-testid={`${testIDPrefix}-file-input`}
        aria-label={props.inputLabel}
        style={{ display: 'none' }}
        onChange={(event) => {
          const chosen = event.currentTarget.files?.[0];
          onChange(chosen ? { name: chosen.name, blob: chosen } : null);
          // Choosing the same file again after an upload should fire change again.
          event.currentTarget.value = '';
        }}
      />
      <Button
        label={file ? props.chooseAgainLabel : props.chooseLabel}
        onPress={() => input.current?.click()}
        disabled={disabled}
        testID={`${testIDPrefix}-choose`}
      />
      <AppText tone={file ? 'default' : 'muted'} testID={`${testIDPrefix}-chosen`} style={styles.name}>
        {file ? `${file.name} (${formatBytes(file.blob.size)})` : props.emptyText}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  name: { flexShrink: 1 },
});
