/**
 * The password rule both ends state (after OWASP ASVS 4.0 V2.1): the server enforces it in full
 * (server/auth/password-policy.ts, with its list of common passwords); the client checks only the
 * length, counted in characters (Unicode code points), to answer sooner.
 */
export const passwordMinLength = 12;
export const passwordMaxLength = 128;

/** The rule as a person reads it. */
export const passwordRule =
  `At least ${passwordMinLength} characters (up to ${passwordMaxLength}); spaces are allowed. ` +
  'Not a common password, a repeated or sequential pattern, the product name or the email name.';

/** A password's length as the rule counts it: characters, not UTF-16 units or bytes. */
export const passwordLength = (password: string) => [...password].length;
