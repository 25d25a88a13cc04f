/**
 * The problems of a form in one place, at its top, so a long form on a phone shows that
 * something needs fixing even when the field is scrolled out of view. On web it scrolls itself
 * into view and takes focus each time it appears or the form is sent again, and each problem is
 * a link that takes focus to its field.
 */
import { Pressable, StyleSheet, View } from 'react-native';

import { AppText } from '@/components/ui/AppText';
import { Notice } from '@/components/ui/Notice';
import { fieldTestID, type FieldErrors } from './formFields';
import { focusField, useReveal } from './useReveal';

interface FormErrorSummaryProps {
  errors: FieldErrors;
  /** Words for field paths, e.g. { "element.pipeDiameterM": "Pipe inside diameter" }. */
  labels: Record<string, string>;
  /** A failure that names no field (a lost connection, a refusal). */
  general?: string | null;
  testID?: string;
  /** The form's test id prefix: with it, each problem links to its field (fieldTestID(prefix, path)). */
  fieldPrefix?: string;
  /** Changes on each submit, so the same problems are brought into view again; without it, a change of problems does. */
  revealKey?: unknown;
}

/** @returns the test ids a problem's field may have, most precise first ("a.b.c", then "a.b", then "a") */
function candidateIDs(prefix: string, path: string): string[] {
  const parts = path.split('.');
  return parts.map((_, index) => fieldTestID(prefix, parts.slice(0, parts.length - index).join('.')));
}

export function FormErrorSummary({ errors, labels, general, testID, fieldPrefix, revealKey }: FormErrorSummaryProps) {
  const entries = Object.entries(errors);
  const shown = entries.length > 0 || Boolean(general);
  const content = shown ? JSON.stringify([general, entries]) : '';
  const ref = useReveal(shown ? `${String(revealKey ?? '')}|${content}` : null);
  if (!shown) return null;
  return (
    <View ref={ref} aria-live="assertive" testID={testID ? `${testID}-region` : undefined}>
      <Notice
        tone="error"
        title={
          entries.length
            ? `Check ${entries.length === 1 ? 'this field' : `these ${entries.length} fields`}`
            : 'Not saved'
        }
        testID={testID}
      >
        {general ? <AppText>{general}</AppText> : null}
        {entries.map(([path, message]) => {
          const text = `${labels[path] ?? path}: ${message}`;
          if (!fieldPrefix) return <AppText key={path}>{text}</AppText>;
          return (
            <Pressable
              key={path}
              role="link"
              onPress={() => focusField(candidateIDs(fieldPrefix, path))}
              testID={testID ? `${testID}-go-${path.replace(/\./g, '-')}` : undefined}
              style={styles.entry}
            >
              <AppText style={styles.link}>{text}</AppText>
            </Pressable>
          );
        })}
      </Notice>
    </View>
  );
}

const styles = StyleSheet.create({
  entry: { minHeight: 44, justifyContent: 'center' },
  link: { textDecorationLine: 'underline' },
});
