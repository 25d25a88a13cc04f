/**
 * Wraps a form's outcome (a "done" note, a failure) so that it is scrolled into view and
 * focused whenever `when` becomes a new truthy value (see useReveal): one way for every form.
 */
import type { ReactNode } from 'react';
import { View } from 'react-native';

import { useReveal } from './useReveal';

export function Reveal({ when, children }: { when: unknown; children: ReactNode }) {
  const ref = useReveal(when);
  return <View ref={ref}>{children}</View>;
}
