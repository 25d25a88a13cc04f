import { badRequest, conflict, notFound } from '../../errors';
import { recordAuditEvent } from '../../audit';
import { hashPassword } from '../../auth/passwords';
import { checkPasswordPolicy } from '../../auth/password-policy';
import type { SignedInUser } from '../../auth/passport';
import type { Role } from '../../../shared/auth/roles';
import { isDuplicateEmail, type UserChanges, type UsersRepository } from './repository';
import { presentUser } from './presenter';

/** @throws 400 naming password with the reason when the password policy refuses it */
function assertPasswordPolicy(password: string, email: string) {
  const reason = checkPasswordPolicy(password, { email });
  if (reason) throw badRequest(`password: ${reason}`, 'password', 'invalid_field');
}

/** Every user, oldest first. */
export function listUsers(repository: UsersRepository) {
  return repository.list();
}

/**
 * Creates a user with a hashed password and audits it (the audit keeps the user as the API shows it).
 * @throws 400 naming password when the password policy refuses it; 409 naming email when a user has that email in any letter case
 */
export async function createUser(
  repository: UsersRepository,
  input: { email: string; name: string; role: Role; password: string },
  actor: SignedInUser,
) {
  assertPasswordPolicy(input.password, input.email);
  const passwordHash = await hashPassword(input.password);
  try {
    return await repository.transaction(async (transaction) => {
      const created = await repository.create(
        { email: input.email, name: input.name, role: input.role, passwordHash },
        transaction,
      );
      await recordAuditEvent(
        { actor, action: 'user.create', entityType: 'user', entityId: created.id, after: presentUser(created) },
        transaction,
      );
      return created;
    });
  } catch (err) {
    if (isDuplicateEmail(err)) throw conflict('A user with this email already exists.', 'email', 'duplicate');
    throw err;
  }
}

/**
 * Changes a user's name, role, disabled flag or password, audited with the values before and after.
 * A new password, a different role or disabling revokes every token issued before (the token version).
 * @throws 409 when admins would disable or demote themselves; 400 naming password when the policy refuses it; not found
 */
export async function updateUser(
  repository: UsersRepository,
  id: string,
  input: { name?: string; role?: Role; disabled?: boolean; password?: string },
  actor: SignedInUser,
) {
  if (id === actor.id && (input.disabled === true || (input.role && input.role !== 'admin'))) {
    // An admin who disables or demotes themselves can lock everyone out of administration.
    throw conflict('You cannot disable or demote your own account.', input.disabled ? 'disabled' : 'role');
  }
  const changes: UserChanges = {
    name: input.name,
    role: input.role,
    disabled: input.disabled,
    revokeTokens: (before) =>
      input.password !== undefined ||
      (input.role !== undefined && input.role !== before.role) ||
      (input.disabled === true && !before.disabled),
  };
  if (input.password !== undefined) {
    const user = await repository.findById(id);
    if (!user) throw notFound('User');
    assertPasswordPolicy(input.password, user.email);
    changes.passwordHash = await hashPassword(input.password);
  }
  return repository.transaction(async (transaction) => {
    const updated = await repository.update(id, changes, transaction);
    if (!updated) throw notFound('User');
    const action = input.password !== undefined ? 'user.update-with-password' : 'user.update';
    await recordAuditEvent(
      {
        actor,
        action,
        entityType: 'user',
        entityId: id,
        before: presentUser(updated.before),
        after: presentUser(updated.after),
      },
      transaction,
    );
    return updated.after;
  });
}
