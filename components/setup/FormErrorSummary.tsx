/**
 * The problems of a form in one place, at its top, so a long form on a phone shows that
 * something needs fixing even when the field is scrolled out of view.
 */
import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';
import type { FieldErrors } from './formFields';

interface FormErrorSummaryProps {
  errors: FieldErrors;
  /** Words for field paths, e.g. { "element.pipeDiameterM": "Pipe inside diameter" }. */
  labels: Record<string, string>;
  /** A failure that names no field (a lost connection, a refusal). */
  general?: string | null;
  testID?: string;
}

export function FormErrorSummary({ errors, labels, general, testID }: FormErrorSummaryProps) {
  const entries = Object.entries(errors);
  if (entries.length === 0 && !general) return null;
  return (
    <Notice
      tone="alarm"
      title={
        entries.length ? `Check ${entries.length === 1 ? 'this field' : `these ${entries.length} fields`}` : 'Not saved'
      }
      testID={testID}
    >
      {general ? <AppText>{general}</AppText> : null}
      {entries.map(([path, message]) => (
        <AppText key={path}>{`${labels[path] ?? path}: ${message}`}</AppText>
      ))}
    </Notice>
  );
}
