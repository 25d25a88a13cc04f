/** Props shared by the web and native file pickers of the imports screen. */
import type { ImportFile } from '@/hooks/api/imports';

export interface ImportsFilePickerProps {
  file: ImportFile | null;
  onChange: (file: ImportFile | null) => void;
  disabled?: boolean;
}
