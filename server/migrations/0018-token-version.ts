import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

/**
 * A token version per user (issue 12 §6). Every bearer token carries the version its user had
 * when it was issued; a password change, a role change or disabling the account adds one, so
 * every token issued before stops working at once instead of when it expires. The check reads
 * the user by primary key, the lookup every authenticated request already made.
 */
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE users ADD COLUMN token_version integer NOT NULL DEFAULT 0;');
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE users DROP COLUMN token_version;');
};
