import type { User } from '../../models';

export function presentUser(user: User, options: { brief?: boolean } = {}) {
  const brief = { id: String(user.id), email: user.email, name: user.name, role: user.role };
  if (options.brief) return brief;
  return { ...brief, disabled: user.disabled, createdAt: user.createdAt.toISOString() };
}
