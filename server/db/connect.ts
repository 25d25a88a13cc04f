import { Sequelize } from 'sequelize';

/** One Sequelize instance per process; SQL logging off (pino-style logs come later). */
export function connectDatabase(databaseUrl: string): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    // Sequelize drops a connection that errors (its own listener) and fails a request at once when
    // a new one is refused; the timeout bounds the wait when the database host does not answer at
    // all, so a request gets a 503 in seconds instead of hanging.
    pool: { max: 10, min: 0, idle: 10_000 },
    dialectOptions: { connectionTimeoutMillis: 5000, keepAlive: true },
    define: { underscored: true },
  });
}
