import { Sequelize } from 'sequelize';

/** One Sequelize instance per process; SQL logging off (pino-style logs come later). */
export function connectDatabase(databaseUrl: string): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  });
}
