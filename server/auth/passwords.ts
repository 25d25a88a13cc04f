import bcrypt from 'bcryptjs';

/** bcrypt cost 10: about 50 ms here, enough against offline guessing for a plant-floor tool. */
const rounds = 10;

export const hashPassword = (password: string) => bcrypt.hash(password, rounds);
export const checkPassword = (password: string, hash: string) => bcrypt.compare(password, hash);
