/**
 * A screen showing one thing (a meter run) names it in the header and the browser tab, in place of
 * its area's title ("Meter runs"). The screen sets the title for its own path; the shell reads it
 * only while that path is open, so a title can never outlive its screen.
 */
import { usePathname } from 'expo-router';
import { useEffect, useSyncExternalStore } from 'react';

let current: { path: string; title: string } | null = null;
const listeners = new Set<() => void>();

function set(next: typeof current) {
  current = next;
  listeners.forEach((listener) => listener());
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

const snapshot = () => current;

/** @param title the open screen's own title, or undefined while it is not known yet */
export function useScreenTitle(title: string | undefined): void {
  const path = usePathname();
  useEffect(() => {
    if (title === undefined) return;
    set({ path, title });
    return () => {
      if (current?.path === path && current.title === title) set(null);
    };
  }, [path, title]);
}

/** @returns the title the open screen set for `path`, if any (for the shell) */
export function useScreenTitleFor(path: string): string | undefined {
  const state = useSyncExternalStore(subscribe, snapshot, snapshot);
  return state?.path === path ? state.title : undefined;
}
