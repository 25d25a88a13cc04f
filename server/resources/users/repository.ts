import { Op, UniqueConstraintError, col, fn, where, type Sequelize, type Transaction } from 'sequelize';
import { User } from '../../models';
import type { Role } from '../../../shared/auth/roles';
import { normaliseEmail } from '../../auth/email';

/** A user as the rest of the server sees one: no password hash. */
export interface UserRecord {
  id: string;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  createdAt: Date;
}

/** A user with the hash sign-in checks a password against, and the token version a new token carries. */
export interface UserCredentials extends UserRecord {
  passwordHash: string;
  tokenVersion: number;
}

export interface UserChanges {
  name?: string;
  role?: Role;
  disabled?: boolean;
  passwordHash?: string;
  /** Whether to add one to the user's token version (so every token issued before is refused), judged on the user before. */
  revokeTokens?: (before: UserRecord) => boolean;
}

export interface UsersRepository {
  /** Runs work in one transaction (the change and its audit event). */
  transaction<T>(work: (transaction: Transaction) => Promise<T>): Promise<T>;
  list(): Promise<UserRecord[]>;
  /** @throws an error that isDuplicateEmail recognises when the email is taken in any letter case */
  create(
    user: { email: string; name: string; role: Role; passwordHash: string },
    transaction: Transaction,
  ): Promise<UserRecord>;
  /** Locks the user, applies the changes given (undefined ones are left alone). @returns before and after, or null */
  update(
    id: string,
    changes: UserChanges,
    transaction: Transaction,
  ): Promise<{ before: UserRecord; after: UserRecord } | null>;
  /** Looks a user up by email in any letter case, with spaces around it ignored. */
  findByEmail(email: string): Promise<UserCredentials | null>;
  /** Looks a user up by id. */
  findById(id: string): Promise<UserRecord | null>;
}

const toRecord = (u: User): UserRecord => ({
  id: String(u.id),
  email: u.email,
  name: u.name,
  role: u.role,
  disabled: u.disabled,
  createdAt: u.createdAt,
});

/** Whether an error is the unique index on lower(email) refusing a second user with that email. */
export const isDuplicateEmail = (err: unknown) => err instanceof UniqueConstraintError;

export function usersRepository(sequelize: Sequelize): UsersRepository {
  return {
    transaction: (work) => sequelize.transaction(work),

    async list() {
      return (await User.findAll({ order: [['id', 'ASC']] })).map(toRecord);
    },

    async create(user, transaction) {
      return toRecord(await User.create(user, { transaction }));
    },

    async update(id, changes, transaction) {
      const found = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!found) return null;
      const before = toRecord(found);
      const { revokeTokens, ...fields } = changes;
      for (const [key, value] of Object.entries(fields)) if (value !== undefined) found.set(key, value);
      if (revokeTokens?.(before)) found.set('tokenVersion', found.tokenVersion + 1);
      await found.save({ transaction });
      return { before, after: toRecord(found) };
    },

    async findByEmail(email) {
      const user = await User.findOne({ where: where(fn('lower', col('email')), { [Op.eq]: normaliseEmail(email) }) });
      return user ? { ...toRecord(user), passwordHash: user.passwordHash, tokenVersion: user.tokenVersion } : null;
    },

    async findById(id) {
      const user = await User.findByPk(id);
      return user ? toRecord(user) : null;
    },
  };
}
