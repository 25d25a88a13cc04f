import crypto from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import { createServices, type Services } from '../services';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { connectDatabase } from '../db/connect';
import { migrate } from '../db/migrate';
import { initModels } from '../models';
import { createApp } from '../app';
import { hashPassword } from '../auth/passwords';
import { issueToken } from '../auth/tokens';
import type { Role } from '../../shared/auth/roles';

/**
 * The real app on the real test database (`npm test` creates it and sets TEST_DATABASE_URL).
 * Each test file gets its own connection; tests make their own users with unique emails so
 * files can run in parallel without cleaning up after each other.
 */
// Models are bound to one connection per process, so every app of a test file shares it.
let shared: { sequelize: Sequelize; services: Services; users: number } | null = null;

export async function testApp(options: { loginLimit?: number } = {}) {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run the tests with `npm test`, which starts PostgreSQL.');
  if (!shared) {
    const connection = connectDatabase(url);
    initModels(connection);
    await migrate(connection, url);
    const services = createServices({
      databaseUrl: url,
      sequelize: connection,
      // One data folder per jest worker: files of parallel test files (certificates, originals)
      // never mix, so a test may count what its own requests stored.
      dataDir: path.join(os.tmpdir(), 'tallyrun-jest', `worker-${process.env.JEST_WORKER_ID ?? process.pid}`),
    });
    shared = { sequelize: connection, services, users: 0 };
  }
  shared.users++;
  const { sequelize, services } = shared;
  const jwtSecret = crypto.randomBytes(32).toString('hex');
  const app: Express = createApp({
    sequelize,
    jwtSecret,
    tokenHours: 1,
    loginLimit: options.loginLimit ?? 1000,
    health: async () => ({ database: 'up', broker: 'up' }),
    services,
  });
  const unique = () => crypto.randomBytes(5).toString('hex');

  /** Creates a user with the role and returns it with a valid token. */
  async function signedIn(role: Role, password = 'correct-horse-battery') {
    const email = `${role}-${unique()}@test.tallyrun`;
    const [rows] = await sequelize.query(
      `INSERT INTO users (email, name, role, password_hash) VALUES (:email, :name, :role, :hash) RETURNING id`,
      { replacements: { email, name: `Test ${role}`, role, hash: await hashPassword(password) } },
    );
    const id = String((rows as { id: string }[])[0].id);
    return { id, email, password, role, token: issueToken({ id, role }, jwtSecret, 1) };
  }

  return {
    app,
    sequelize,
    services,
    jwtSecret,
    signedIn,
    unique,
    http: () => request(app),
    close: async () => {
      if (shared && --shared.users === 0) {
        shared = null;
        await services.close();
        await sequelize.close();
      }
    },
  };
}
