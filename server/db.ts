import { Sequelize } from 'sequelize';
import { env } from './env';

export function createSequelize(url = env.NODE_ENV === 'test' ? env.TEST_DATABASE_URL : env.DATABASE_URL): Sequelize {
  return new Sequelize(url, {
    dialect: 'postgres',
    logging: env.SQL_LOG ? console.log : false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  });
}
