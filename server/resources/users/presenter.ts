import type { UserRecord } from './repository';

/** A user as JSON, never with the password hash; `brief` is what sign-in returns. */
export function presentUser(user: UserRecord, options: { brief?: boolean } = {}) {
  const brief = { id: user.id, email: user.email, name: user.name, role: user.role };
  if (options.brief) return brief;
  return { ...brief, disabled: user.disabled, createdAt: user.createdAt.toISOString() };
}
