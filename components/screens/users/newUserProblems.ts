/** What can be checked of a new user before asking the server; the server has the last word. */
import type { NewUser } from '@/hooks/api/users';

export type NewUserField = keyof NewUser;

/** The server's rule (server/resources/users/schema.ts); repeated here only to answer sooner. */
export const minPasswordLength = 8;

/**
 * @param user the form's new user
 * @returns the problem of each field at fault, in words for the person typing
 */
export function localProblems(user: NewUser): Partial<Record<NewUserField, string>> {
  const problems: Partial<Record<NewUserField, string>> = {};
  if (!user.name.trim()) problems.name = 'Enter the person’s name.';
  if (!/^[^\s@]+@[^\s@]+$/.test(user.email.trim())) problems.email = 'Enter an email address such as name@example.com.';
  if (user.password.length < minPasswordLength) problems.password = `Use at least ${minPasswordLength} characters.`;
  return problems;
}
