/** What can be checked of a new user before asking the server; the server has the last word. */
import type { NewUser } from '@/hooks/api/users';
import { passwordLength, passwordMinLength } from '@/shared/auth/password-rule';

export type NewUserField = keyof NewUser;

/** The server's length rule (shared/auth/password-rule.ts); the server also refuses common and patterned passwords. */
export const minPasswordLength = passwordMinLength;

/**
 * @param user the form's new user
 * @returns the problem of each field at fault, in words for the person typing
 */
export function localProblems(user: NewUser): Partial<Record<NewUserField, string>> {
  const problems: Partial<Record<NewUserField, string>> = {};
  if (!user.name.trim()) problems.name = 'Enter the person’s name.';
  if (!/^[^\s@]+@[^\s@]+$/.test(user.email.trim())) problems.email = 'Enter an email address such as name@example.com.';
  if (passwordLength(user.password) < minPasswordLength)
    problems.password = `Use at least ${minPasswordLength} characters.`;
  return problems;
}
