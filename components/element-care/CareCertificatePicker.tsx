/** Native: no document picker yet; a record is kept without its certificate file, which the web app can attach. */
import { Notice } from '@/components/ui/Notice';
import type { CareCertificatePickerProps } from './CareCertificatePicker.types';

export function CareCertificatePicker(_props: CareCertificatePickerProps) {
  return <Notice>Attaching a certificate works in the web app: open Tallyrun in a browser.</Notice>;
}
