import fs from 'node:fs';
import path from 'node:path';
import { passwordLength, passwordMaxLength, passwordMinLength, passwordRule } from '../../shared/auth/password-rule';

/**
 * The password policy, after OWASP ASVS 4.0 section V2.1: at least 12 characters counted as Unicode
 * code points, at most 128, any characters including spaces (but not only spaces), no composition
 * rules, and no password that is common, breached or a simple pattern. Applied wherever a password
 * is set: creating a user and changing a password (server/resources/users), and the production
 * check of the demo password.
 */
export { passwordMinLength, passwordMaxLength, passwordRule };

const productName = 'tallyrun';

/** Case folded, spaces, punctuation and symbols removed: "Pass word!" and "password" compare equal. */
const compact = (text: string) =>
  text
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[\s\p{P}\p{S}]/gu, '');
const trimDigits = (text: string) => text.replace(/^\d+|\d+$/g, '');
/** Undoes the usual swaps of symbols and digits for letters ("p@ssw0rd" is "password"). */
const unswap = (text: string) =>
  text.normalize('NFKC').toLowerCase().replace(/@/g, 'a').replace(/\$/g, 's').replace(/!/g, 'i');
const unswapDigits = (text: string, one: 'i' | 'l') =>
  text
    .replace(/0/g, 'o')
    .replace(/1/g, one)
    .replace(/3/g, 'e')
    .replace(/4/g, 'a')
    .replace(/5/g, 's')
    .replace(/7/g, 't');

let common: Set<string> | null = null;
/** The shipped list (server/auth/common-passwords.txt, where it comes from is said at its top), compacted. */
function commonPasswords(): Set<string> {
  if (!common) {
    const text = fs.readFileSync(path.join(__dirname, 'common-passwords.txt'), 'utf8');
    common = new Set(
      text
        .split('\n')
        .map((line) => line.trim())
        .filter((line) => line && !line.startsWith('#'))
        .map(compact)
        .filter(Boolean),
    );
  }
  return common;
}

const keyboardRows = ['1234567890', 'qwertyuiop', 'asdfghjkl', 'zxcvbnm', 'qwertzuiop', 'azertyuiop', 'yxcvbnm'];

/** Whether the text only walks a run of neighbouring characters (abcdef…, 987654…, 1234567890 12…, qwerty…). */
function isSequence(text: string): boolean {
  if (text.length < 3) return false;
  const digitsOnly = /^\d+$/.test(text);
  for (const step of [1, -1]) {
    let run = true;
    for (let i = 1; i < text.length && run; i++) {
      const a = text.codePointAt(i - 1)!;
      const b = text.codePointAt(i)!;
      run = digitsOnly ? (b - 48 - (a - 48) - step + 20) % 10 === 0 : b - a === step;
    }
    if (run) return true;
  }
  return keyboardRows.some((row) => {
    const ring = row.repeat(Math.ceil(text.length / row.length) + 1);
    const reversed = [...ring].reverse().join('');
    return ring.includes(text) || reversed.includes(text);
  });
}

/**
 * Checks a password against the policy.
 * @param context email: the account's email, whose name (before the @) may not be the password
 * @returns null when the password may be used, otherwise the reason, worded to follow the field
 *   name ("password: must be at least 12 characters")
 */
export function checkPasswordPolicy(password: string, context: { email?: string } = {}): string | null {
  const length = passwordLength(password);
  if (length < passwordMinLength) return `must be at least ${passwordMinLength} characters (this has ${length})`;
  if (length > passwordMaxLength) return `must be at most ${passwordMaxLength} characters (this has ${length})`;
  if (password.trim() === '') return 'must not be only spaces';

  const folded = compact(password);
  if (folded.length === 0) return 'must not be only punctuation and symbols';
  if (/^(.{1,4})\1+$/su.test(folded)) return 'must not be one character or a short group of characters repeated';
  if (isSequence(folded) || isSequence(trimDigits(folded))) return 'must not be a sequence such as 123456… or qwerty…';

  const list = commonPasswords();
  const variants = new Set<string>([folded, trimDigits(folded)]);
  for (const one of ['i', 'l'] as const) {
    const letters = compact(unswap(password));
    variants.add(letters);
    variants.add(unswapDigits(trimDigits(letters), one));
  }
  for (const variant of variants)
    if (list.has(variant)) return 'is a common password (it is on the list of passwords that are guessed first)';

  // The product name and the person's own email name, with little else added, are guessed early.
  const names = [productName];
  const emailName = context.email ? compact(context.email.split('@')[0]) : '';
  if (emailName.length >= 3) names.push(emailName);
  let rest = folded;
  for (const name of names) rest = rest.split(name).join('');
  if (rest !== folded && (rest.length < 6 || /^\d+$/.test(rest)))
    return 'must not be the product name or the email name with only a little added';
  return null;
}
