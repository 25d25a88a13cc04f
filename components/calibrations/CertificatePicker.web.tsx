/**
 * Web: picks a certificate (PDF, PNG or JPEG) with the browser's own file chooser, opened by a
 * button; on a phone the browser offers the camera too. The server judges the type by content.
 */
import { useRef } from 'react';
import { StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { formatBytes } from '@/components/screens/ImportsFormat';
import { space } from '@/constants/theme';
import type { CertificatePickerProps } from './CertificatePicker.types';

export function CertificatePicker({ file, onChange, disabled }: CertificatePickerProps) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <View style={styles.row}>
      <input
        ref={input}
        type="file"
        accept="application/pdf,image/png,image/jpeg,.pdf,.png,.jpg,.jpeg"
        data-testid="certificate-file-input"
        aria-label="Certificate file"
        style={{ display: 'none' }}
        onChange={(event) => {
          const chosen = event.currentTarget.files?.[0];
          onChange(chosen ? { name: chosen.name, blob: chosen } : null);
          event.currentTarget.value = '';
        }}
      />
      <Button
        label={file ? 'Choose another certificate…' : 'Attach the certificate…'}
        onPress={() => input.current?.click()}
        disabled={disabled}
        testID="certificate-choose"
      />
      <AppText tone={file ? 'default' : 'muted'} testID="certificate-chosen" style={styles.name}>
        {file
          ? `${file.name} (${formatBytes(file.blob.size)})`
          : 'No certificate attached (PDF, PNG or JPEG, up to 10 MB)'}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  name: { flexShrink: 1 },
});
