/** Web: picks a CSV with the browser's own file chooser and names the chosen file and its size. */
import { WebFileChooser } from '@/components/ui/WebFileChooser';
import type { ImportsFilePickerProps } from './ImportsFilePicker.types';

export function ImportsFilePicker(props: ImportsFilePickerProps) {
  return (
    <WebFileChooser
      {...props}
      accept=".csv,text/csv,text/plain"
      inputLabel="CSV file"
      chooseLabel="Choose a CSV file…"
      chooseAgainLabel="Choose another file…"
      emptyText="No file chosen"
      testIDPrefix="import"
    />
  );
}
