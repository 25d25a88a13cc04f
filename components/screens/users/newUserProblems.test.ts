import { localProblems, minPasswordLength } from './newUserProblems';

const user = {
  name: 'An Operator',
  email: 'operator@example.com',
  role: 'operator' as const,
  password: 'long enough too',
};

describe('localProblems', () => {
  it('finds nothing wrong with a complete new user', () => {
    expect(localProblems(user)).toEqual({});
  });

  it('names each field at fault, in words for the person typing', () => {
    expect(localProblems({ ...user, name: '  ', email: 'operator', password: 'short' })).toEqual({
      name: 'Enter the person’s name.',
      email: 'Enter an email address such as name@example.com.',
      password: 'Use at least 12 characters.',
    });
  });

  it('asks for an email address with one @ and no blanks', () => {
    expect(localProblems({ ...user, email: ' operator@example.com ' }).email).toBeUndefined();
    expect(localProblems({ ...user, email: 'an operator@example.com' }).email).toBeDefined();
    expect(localProblems({ ...user, email: 'a@b@c' }).email).toBeDefined();
    expect(localProblems({ ...user, email: '@example.com' }).email).toBeDefined();
  });

  it('takes a password of exactly the minimum length, counted in characters', () => {
    expect(minPasswordLength).toBe(12); // OWASP ASVS 4.0 V2.1.1
    expect(localProblems({ ...user, password: 'abcdefghijkl' }).password).toBeUndefined();
    expect(localProblems({ ...user, password: 'abcdefghijk' }).password).toBe('Use at least 12 characters.');
    // 11 characters, 12 UTF-16 units: one emoji is one character.
    expect(localProblems({ ...user, password: 'abcdefghij🌵' }).password).toBe('Use at least 12 characters.');
  });
});
