/** Props shared by the web and native certificate pickers. */
import type { CertificateFile } from './api';

export interface CertificatePickerProps {
  file: CertificateFile | null;
  onChange: (file: CertificateFile | null) => void;
  disabled?: boolean;
}
