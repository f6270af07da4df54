import "server-only";
import { Sequelize } from "sequelize";
import { getEnv, type Env } from "@/lib/env";
import * as models from "@/models";
import { initModels } from "@/models";

type Holder = { __greaseledgerSequelize?: Sequelize; __greaseledgerStatements?: { count: number } };
const holder = globalThis as Holder;

/** Counts SQL statements, so benchmarks and tests can see how many a request made. */
export const statementCounter = (holder.__greaseledgerStatements ??= { count: 0 });

/** A Sequelize instance for the given settings, with every model registered. */
export function createSequelize(env: Env, options: { poolMax?: number } = {}): Sequelize {
  const sequelize = new Sequelize({
    dialect: "mariadb",
    host: env.DATABASE_HOST,
    port: env.DATABASE_PORT,
    database: env.DATABASE_NAME,
    username: env.DATABASE_USER,
    password: env.DATABASE_PASSWORD,
    timezone: "+00:00",
    logging: () => {
      statementCounter.count += 1;
    },
    benchmark: false,
    pool: { max: options.poolMax ?? env.DATABASE_POOL_MAX, min: 0, acquire: 10_000, idle: 10_000, evict: 5000 },
    dialectOptions: { connectTimeout: 3000, socketTimeout: 30_000 },
    define: { underscored: true },
  });
  initModels(sequelize);
  return sequelize;
}

/**
 * The process-wide instance (kept on globalThis so dev reloads do not open new pools). The models are
 * registered on every call: a production build may hold more than one copy of the models module (one
 * per route bundle), and each copy must be bound to the shared instance before use.
 */
export function getSequelize(): Sequelize {
  holder.__greaseledgerSequelize ??= createSequelize(getEnv());
  initModels(holder.__greaseledgerSequelize);
  return holder.__greaseledgerSequelize;
}

/** The Sequelize models, bound to the process-wide instance. Use this instead of importing models directly. */
export function boundModels(): typeof models {
  getSequelize();
  return models;
}
