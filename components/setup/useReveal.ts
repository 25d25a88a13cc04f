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
  keepInViewWhileLayoutSettles(node, target);
}

/**
 * What a submit changes often re-renders above the outcome a moment later (the list the new site
 * joins grows by a card), pushing it out of view. For a short while, scroll it back whenever that
 * happens (and focus, if a re-render dropped it) — unless the person has scrolled, tapped or typed
 * meanwhile: then the page is theirs.
 */
function keepInViewWhileLayoutSettles(node: HTMLElement, target: HTMLElement): void {
  if (typeof window === 'undefined') return;
  let personActed = false;
  const acted = () => {
    personActed = true;
  };
  const events = ['wheel', 'touchstart', 'keydown', 'mousedown'] as const;
  for (const e of events) window.addEventListener(e, acted, { passive: true, once: true });
  const check = () => {
    if (personActed || !node.isConnected) return;
    const box = node.getBoundingClientRect();
    if (box.top < 0 || box.bottom > window.innerHeight) node.scrollIntoView({ block: 'center' });
    // A re-render that dropped focus to the page leaves nobody reading the outcome: give it back.
    if ((document.activeElement ?? document.body) === document.body && target.isConnected)
      target.focus({ preventScroll: true });
  };
  const timers = [150, 400, 800, 1500].map((ms) => setTimeout(check, ms));
  setTimeout(() => {
    timers.forEach(clearTimeout);
    for (const e of events) window.removeEventListener(e, acted);
  }, 1600);
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
