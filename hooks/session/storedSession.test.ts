import { parseStoredSession } from './storedSession';

const session = { token: 'abc', user: { id: '4', email: 'eng@example.com', name: 'An Engineer', role: 'engineer' } };

describe('parseStoredSession', () => {
  it('reads a stored session', () => {
    expect(parseStoredSession(JSON.stringify(session))).toEqual(session);
  });

  it('reads a numeric user id as text, as every id is on the client', () => {
    const stored = JSON.stringify({ ...session, user: { ...session.user, id: 4 } });
    expect(parseStoredSession(stored)?.user.id).toBe('4');
  });

  it('gives null for nothing stored, unreadable text, an old shape or an unknown role', () => {
    expect(parseStoredSession(null)).toBeNull();
    expect(parseStoredSession('')).toBeNull();
    expect(parseStoredSession('{not json')).toBeNull();
    expect(parseStoredSession(JSON.stringify({ token: 'abc', email: 'eng@example.com' }))).toBeNull();
    expect(parseStoredSession(JSON.stringify({ ...session, token: '' }))).toBeNull();
    expect(parseStoredSession(JSON.stringify({ ...session, user: { ...session.user, role: 'root' } }))).toBeNull();
  });
});
