import "server-only";
import mysql from "mysql2/promise";
import { getEnv } from "@/lib/env";
import { noteDatabaseAnswered } from "./errors";

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

/** How long the session check may wait for the server once its statement is sent. */
export const SESSION_STATEMENT_TIMEOUT_MS = 3000;

/**
 * One short statement through the session pool that gives up after `SESSION_STATEMENT_TIMEOUT_MS`. Every signed-in
 * request starts with the session check, so a server that stopped answering (frozen, or cut off by the network:
 * the socket stays open and mysql2 has no socket timeout) turns into a 503 within seconds instead of a request that
 * hangs. A connection that timed out still has the statement queued on it and is destroyed, never reused.
 */
export async function sessionStatement<T extends mysql.QueryResult>(sql: string, values: unknown[]): Promise<T> {
  const connection = await getMysqlPool().getConnection();
  try {
    const [result] = await connection.query<T>({ sql, timeout: SESSION_STATEMENT_TIMEOUT_MS }, values);
    connection.release();
    noteDatabaseAnswered();
    return result;
  } catch (error) {
    const code = (error as { code?: string }).code;
    if (code === "PROTOCOL_SEQUENCE_TIMEOUT" || (error as { fatal?: boolean }).fatal) connection.destroy();
    else connection.release();
    throw error;
  }
}
