/**
 * Keeps the session (bearer token and user) in the browser's localStorage, so a reload or a
 * deep link opened in a new tab stays signed in. Reads are guarded: storage can be missing
 * (static rendering in Node) or refuse access (private modes).
 */
import { parseStoredSession, type StoredSession } from './storedSession';

const storageKey = 'tallyrun.session';

function storage(): Storage | null {
  try {
    return typeof window !== 'undefined' && window.localStorage ? window.localStorage : null;
  } catch {
    return null;
  }
}

/** @returns the stored session, or null when there is none */
export function readSession(): StoredSession | null {
  return parseStoredSession(storage()?.getItem(storageKey) ?? null);
}

/** @param session the session to keep, replacing any other */
export function writeSession(session: StoredSession): void {
  storage()?.setItem(storageKey, JSON.stringify(session));
}

/** Forgets the stored session. */
export function clearSession(): void {
  storage()?.removeItem(storageKey);
}

/**
 * Tells the listener when another tab signs in or out, so every tab follows.
 * @param listener called with the session now stored (null after a sign-out)
 * @returns a function that stops listening
 */
export function subscribeToSessionChanges(listener: (session: StoredSession | null) => void): () => void {
  if (typeof window === 'undefined' || typeof window.addEventListener !== 'function') return () => {};
  const onStorage = (event: StorageEvent) => {
    if (event.key === storageKey || event.key === null) listener(readSession());
  };
  window.addEventListener('storage', onStorage);
  return () => window.removeEventListener('storage', onStorage);
}
