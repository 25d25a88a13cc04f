/** Native: no document picker yet; a calibration is recorded without its certificate, which the web app can add. */
import { Notice } from '@/components/ui/Notice';
import type { CertificatePickerProps } from './CertificatePicker.types';

export function CertificatePicker(_props: CertificatePickerProps) {
  return <Notice>Attaching a certificate works in the web app: open Tallyrun in a browser.</Notice>;
}
