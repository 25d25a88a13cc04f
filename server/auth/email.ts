/**
 * The one rule for an account's email, used wherever an account is looked up or keyed: surrounding
 * spaces are dropped and letters lower-cased. Accounts are created with their email normalised
 * this way (server/resources/users/schema.ts), sign-in looks them up by it, and the sign-in rate
 * limit counts attempts by it, so `" User@x "` is the same account, and the same limit, as `user@x`.
 */
export const normaliseEmail = (email: string) => email.trim().toLowerCase();

/** The account key of a request body's `email`, whatever its type (the limiter runs before validation). */
export const accountKey = (email: unknown) => (typeof email === 'string' ? normaliseEmail(email) : '');
