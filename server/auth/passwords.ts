import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';

/** bcrypt cost 10: about 50 ms here, enough against offline guessing for a plant-floor tool. */
const rounds = 10;

export const hashPassword = (password: string) => bcrypt.hash(password, rounds);
export const checkPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

let dummy: Promise<string> | null = null;

/**
 * Compares the password against a hash of a random secret at the same cost, and answers false.
 * Sign-in calls it for an email no account has, so an unknown email takes as long as a wrong
 * password and the answer time does not tell who has an account.
 */
export async function checkAgainstDummyHash(password: string): Promise<false> {
  dummy ??= hashPassword(crypto.randomBytes(18).toString('base64'));
  await bcrypt.compare(password, await dummy);
  return false;
}
