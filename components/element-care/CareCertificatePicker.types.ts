/** Props shared by the web and native certificate pickers of the element care panels. */
import type { ChosenCertificate } from './careApi';

export interface CareCertificatePickerProps {
  file: ChosenCertificate | null;
  onChange: (file: ChosenCertificate | null) => void;
  disabled?: boolean;
  /** Three panels share a screen: each gives its own test id prefix. */
  testIDPrefix: string;
}
