import "server-only";
import mariadb from "mariadb";
import { getEnv } from "@/lib/env";

type Holder = { __greaseledgerBulkPool?: mariadb.Pool };
const holder = globalThis as Holder;

/**
 * A small pool of the mariadb driver's own connections for bulk reads (the streamed exports, long lists). Sequelize runs a
 * JavaScript type-cast for every field and builds an object per row; for hundreds of thousands of rows read as
 * arrays of strings that costs more than the query, so exports read a page at a time through this pool instead.
 * Same account as the app; a connection is taken per page and given back, so a slow download holds none.
 */
export function getBulkReadPool(): mariadb.Pool {
  if (!holder.__greaseledgerBulkPool) {
    const env = getEnv();
    holder.__greaseledgerBulkPool = mariadb.createPool({
      host: env.DATABASE_HOST,
      port: env.DATABASE_PORT,
      database: env.DATABASE_NAME,
      user: env.DATABASE_USER,
      password: env.DATABASE_PASSWORD,
      timezone: "+00:00",
      // Ids fit in a double; decimals stay strings so a CSV shows them as stored (12.50, not 12.5).
      bigIntAsNumber: true,
      decimalAsNumber: false,
      connectionLimit: Math.max(2, Math.ceil(env.DATABASE_POOL_MAX / 4)),
      acquireTimeout: 10_000,
      connectTimeout: 3000,
      socketTimeout: 30_000,
      idleTimeout: 60,
      // 0 here leaves the pool unable to open any connection (mariadb 3.0.2); one idle connection is cheap.
      minimumIdle: 1,
    });
  }
  return holder.__greaseledgerBulkPool;
}

/**
 * A read-only SELECT through the same pool, for long lists: rows come back as the driver parses them, without the
 * ORM's per-cell conversion hook (which made a 3,500-row list about three times slower than its SQL). `?`
 * placeholders; an array value expands to a list, as in `IN (?)`.
 */
export async function selectRows<T>(sql: string, params: unknown[]): Promise<T[]> {
  return (await getBulkReadPool().query(sql, params)) as T[];
}
