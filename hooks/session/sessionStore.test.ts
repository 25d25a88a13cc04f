import { clearSession, readSession, subscribeToSessionChanges, writeSession } from './sessionStore';
import { parseStoredSession } from './storedSession';

const session = { token: 'abc', user: { id: '4', email: 'eng@example.com', name: 'An Engineer', role: 'engineer' } };

describe('the native session store', () => {
  it('keeps a session in memory until it is cleared', () => {
    const stored = parseStoredSession(JSON.stringify(session));
    if (!stored) throw new Error('expected a session');
    expect(readSession()).toBeNull();
    writeSession(stored);
    expect(readSession()).toEqual(session);
    clearSession();
    expect(readSession()).toBeNull();
  });

  it('hears of no changes from elsewhere, and stops listening without fail', () => {
    const stop = subscribeToSessionChanges(() => {
      throw new Error('no other process can change an in-memory session');
    });
    expect(stop).not.toThrow();
  });
});
