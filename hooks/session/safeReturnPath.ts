/**
 * Sign-in remembers where a signed-out visitor was going (`/sign-in?next=/alarms`). Only a
 * path inside this app is followed, so a crafted link cannot send someone elsewhere after they
 * sign in.
 *
 * @param next the `next` search parameter, as given
 * @returns the path to open after sign-in, or undefined when there is none or it is unsafe
 */
export function safeReturnPath(next: string | string[] | undefined): string | undefined {
  const value = Array.isArray(next) ? next[0] : next;
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.includes('\\')) return undefined;
  if (value === '/sign-in' || value.startsWith('/sign-in?')) return undefined;
  return value;
}
