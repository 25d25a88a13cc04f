/**
 * Web: picks a certificate (PDF, PNG or JPEG) with the browser's own file chooser; on a phone the
 * browser offers the camera too. The server judges the type by content.
 */
import { WebFileChooser } from '@/components/ui/WebFileChooser';
import type { CareCertificatePickerProps } from './CareCertificatePicker.types';

export function CareCertificatePicker({ testIDPrefix, ...props }: CareCertificatePickerProps) {
  return (
    <WebFileChooser
      {...props}
      accept="application/pdf,image/png,image/jpeg,.pdf,.png,.jpg,.jpeg"
      inputLabel="Certificate file"
      chooseLabel="Attach the certificate…"
      chooseAgainLabel="Choose another certificate…"
      emptyText="No certificate attached (PDF, PNG or JPEG, up to 10 MB)"
      testIDPrefix={testIDPrefix}
    />
  );
}
