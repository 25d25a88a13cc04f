/**
 * Native stand-in for sessionStore.web.ts with the same functions. Tallyrun ships as a web
 * app for now; on a native build the session lives only as long as the process, until a
 * secure store (the platform keychain) is added.
 */
import type { StoredSession } from './storedSession';

let current: StoredSession | null = null;

/** @returns the session kept in memory, or null */
export function readSession(): StoredSession | null {
  return current;
}

/** @param session the session to keep, replacing any other */
export function writeSession(session: StoredSession): void {
  current = session;
}

/** Forgets the session. */
export function clearSession(): void {
  current = null;
}

/**
 * Other processes cannot change an in-memory session, so there is nothing to hear.
 * @returns a function that stops listening
 */
export function subscribeToSessionChanges(_listener: (session: StoredSession | null) => void): () => void {
  return () => {};
}
