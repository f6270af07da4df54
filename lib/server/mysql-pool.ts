import "server-only";
import mysql from "mysql2/promise";
import { getEnv } from "@/lib/env";

type Holder = { __greaseledgerMysqlPool?: mysql.Pool };
const holder = globalThis as Holder;

/** The small mysql2 pool the session adapter speaks through (it knows only the mysql2 promise API). */
export function getMysqlPool(): mysql.Pool {
  if (!holder.__greaseledgerMysqlPool) {
    const env = getEnv();
    holder.__greaseledgerMysqlPool = mysql.createPool({
      host: env.DATABASE_HOST,
      port: env.DATABASE_PORT,
      database: env.DATABASE_NAME,
      user: env.DATABASE_USER,
      password: env.DATABASE_PASSWORD,
      timezone: "Z",
      connectionLimit: Math.max(2, Math.ceil(env.DATABASE_POOL_MAX / 2)),
      connectTimeout: 3000,
      waitForConnections: true,
      enableKeepAlive: true,
    });
  }
  return holder.__greaseledgerMysqlPool;
}
