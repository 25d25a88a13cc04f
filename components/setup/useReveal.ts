/**
 * Forms answer where the person is looking: when a form's outcome (its error summary or its
 * "added" note) appears or changes, the page scrolls it into view and moves focus to it, so a
 * phone that was scrolled down to the submit button shows what happened, and a screen reader
 * reads it. Web only: on native the notice's live region (role alert or status) speaks it.
 */
import { useEffect, useRef } from 'react';
import { Platform, type View } from 'react-native';

/**
 * @param key what the outcome is (a message, a submit count); each new truthy key reveals it again
 * @returns the ref to put on the outcome's view
 */
export function useReveal<T extends View = View>(key: unknown) {
  const ref = useRef<T>(null);
  useEffect(() => {
    if (!key || Platform.OS !== 'web') return;
    revealNode(ref.current as unknown as HTMLElement | null);
  }, [key]);
  return ref;
}

/** Scrolls a web element into the middle of the view and focuses it (made focusable by script, not by Tab). */
export function revealNode(node: HTMLElement | null, focus: 'self' | 'input' = 'self'): void {
  if (!node || typeof node.scrollIntoView !== 'function') return;
  node.scrollIntoView({ block: 'center' });
  const target =
    focus === 'input'
      ? ((node.matches('input, textarea, select, button')
          ? node
          : node.querySelector<HTMLElement>('input, textarea, select, button')) ?? node)
      : node;
  if (!target.hasAttribute('tabindex') && !target.matches('input, textarea, select, button, a')) {
    target.setAttribute('tabindex', '-1');
  }
  target.focus({ preventScroll: true });
}

/**
 * Focuses the field of a form named by its test id (web), trying the path's parents when the
 * field itself has none (a composition's group for one of its components).
 * @param testIDs candidate test ids, most precise first
 */
export function focusField(testIDs: string[]): void {
  if (Platform.OS !== 'web' || typeof document === 'undefined') return;
  for (const id of testIDs) {
    const node = document.querySelector<HTMLElement>(`[data-testid="${CSS.escape(id)}"]`);
    if (node) {
      revealNode(node, 'input');
      return;
    }
  }
}
