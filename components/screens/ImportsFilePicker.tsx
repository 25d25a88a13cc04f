/**
 * Native: the app has no document picker yet, so it says where to upload instead. Same props
 * as the web version (ImportsFilePicker.web.tsx).
 */
import { Notice } from '@/components/ui/Notice';
import type { ImportsFilePickerProps } from './ImportsFilePicker.types';

export function ImportsFilePicker(_props: ImportsFilePickerProps) {
  return <Notice>Uploading a file works in the web app: open Tallyrun in a browser to import a CSV.</Notice>;
}
