import { checkPasswordPolicy } from './password-policy';

// The rule under test is OWASP ASVS 4.0 section V2.1 (V2.1.1 at least 12 characters, V2.1.2 up to
// 128 allowed, V2.1.4 any Unicode, V2.1.7 refuse breached or common passwords, V2.1.9 no
// composition rules); the cases below come from that text and from issue 12, not from the code.
describe('checkPasswordPolicy', () => {
  it.each([
    'correct horse battery',
    'meter run north 7',
    'ñandú 🌵 ñu y yo',
    'a-long-password',
    'the orifice plate on run four was inspected '.repeat(3).slice(0, 128),
  ])('accepts %j: long enough, no composition rule asked', (password) => {
    expect(checkPasswordPolicy(password, { email: 'dana.okafor@example.com' })).toBeNull();
  });

  it.each([
    ['password', /at least 12 characters \(this has 8\)/],
    ['aaaaaaaa', /at least 12/],
    ['        ', /at least 12/],
    ['ñandú 🌵 ñu', /at least 12 characters \(this has 10\)/],
    ['x'.repeat(129), /at most 128/],
    ['            ', /only spaces/],
    ['!@#$%^&*()_+', /only punctuation/],
    ['aaaaaaaaaaaa', /repeated/],
    ['abcabcabcabc', /repeated/],
    ['123456789012', /sequence/],
    ['zyxwvutsrqpo', /sequence/],
    ['qwertyuiop12', /sequence/],
    ['Password 2026!', /common password/],
    ['p@ssw0rd1234', /common password/],
    ['Iloveyou2024!!', /common password/],
    ['tallyrun-demo', /product name/],
    ['dana.okafor2026', /email name/],
  ])('refuses %j, saying why', (password, reason) => {
    expect(checkPasswordPolicy(password, { email: 'dana.okafor@example.com' })).toMatch(reason);
  });
});
