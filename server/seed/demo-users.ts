import type { Sequelize } from 'sequelize';
import { hashPassword } from '../auth/passwords';
import type { Role } from '../../shared/auth/roles';

/** The demo sign-ins of the product design; two engineers so one can approve the other's correction. */
export const demoUsers: { email: string; name: string; role: Role }[] = [
  { email: 'operator@demo.tallyrun', name: 'Dana Okafor', role: 'operator' },
  { email: 'engineer@demo.tallyrun', name: 'Priya Lindqvist', role: 'engineer' },
  { email: 'engineer2@demo.tallyrun', name: 'Tomás Brandt', role: 'engineer' },
  { email: 'accountant@demo.tallyrun', name: 'Mei Hargrove', role: 'accountant' },
  { email: 'admin@demo.tallyrun', name: 'Sam Ruiz', role: 'admin' },
];

/** Inserts the demo users that are missing; running it again changes nothing. */
export async function seedDemoUsers(sequelize: Sequelize, password: string) {
  const hash = await hashPassword(password);
  for (const u of demoUsers) {
    await sequelize.query(
      `INSERT INTO users (email, name, role, password_hash) VALUES (:email, :name, :role, :hash)
       ON CONFLICT ((lower(email))) DO NOTHING`,
      { replacements: { ...u, hash } },
    );
  }
}
