// A private MariaDB server on loopback: its own data folder, socket and port, never the system service.
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { isRoot, run, startChild, waitFor, which } from "./util.mjs";

/** The socket of the private server whose data lives under `baseDir` (start, test and the backup script agree on it). */
export function socketPath(baseDir) {
  const preferred = path.join(baseDir, "mysqld.sock");
  // A Unix socket path must stay under 107 bytes; fall back to a short name in the temp folder.
  if (Buffer.byteLength(preferred) < 100) return preferred;
  return path.join(os.tmpdir(), `gl-${createHash("sha1").update(baseDir).digest("hex").slice(0, 12)}.sock`);
}

const userArgs = () => (isRoot() ? ["--user=root"] : []);

export function mariadbClient(socket) {
  const client = which("mariadb") ?? which("mysql");
  return (sql, { database, quiet = true } = {}) =>
    run(
      client,
      [
        "--no-defaults",
        `--socket=${socket}`,
        "-uroot",
        "--batch",
        "--skip-column-names",
        ...(database ? [database] : []),
      ],
      {
        input: sql,
        quiet,
      },
    );
}

async function ping(socket) {
  const admin = which("mariadb-admin") ?? which("mysqladmin");
  try {
    await run(admin, ["--no-defaults", `--socket=${socket}`, "-uroot", "--connect-timeout=2", "ping"], {
      quiet: true,
    });
    return true;
  } catch {
    return false;
  }
}

/**
 * Starts (or reuses) a MariaDB server with data under `baseDir`. Returns the socket and a stop function.
 * `reuse`: when a server of this data folder already answers, use it and leave it running on stop.
 */
export async function startMariadb({ baseDir, port, reuse = true, log = () => {} }) {
  const dataDir = path.join(baseDir, "data");
  const socket = socketPath(baseDir);
  mkdirSync(baseDir, { recursive: true });

  if (reuse && existsSync(socket) && (await ping(socket))) {
    log(`reusing the MariaDB server already running on ${socket}`);
    return { socket, port, started: false, stop: async () => {} };
  }

  if (!existsSync(path.join(dataDir, "mysql"))) {
    const installDb = which("mariadb-install-db") ?? which("mysql_install_db");
    log("creating a new MariaDB data folder…");
    await run(
      installDb,
      [
        "--no-defaults",
        `--datadir=${dataDir}`,
        "--auth-root-authentication-method=normal",
        "--skip-test-db",
        ...userArgs(),
      ],
      { quiet: true },
    );
  }

  const mariadbd = which("mariadbd") ?? which("mysqld");
  const errorLog = path.join(baseDir, "error.log");
  const child = startChild(
    "mariadb",
    mariadbd,
    [
      "--no-defaults",
      `--datadir=${dataDir}`,
      `--socket=${socket}`,
      `--pid-file=${path.join(baseDir, "mysqld.pid")}`,
      `--port=${port}`,
      "--bind-address=127.0.0.1",
      "--skip-name-resolve",
      `--log-error=${errorLog}`,
      "--character-set-server=utf8mb4",
      "--collation-server=utf8mb4_unicode_ci",
      "--default-time-zone=+00:00",
      "--innodb-buffer-pool-size=256M",
      "--max-connections=300",
      ...userArgs(),
    ],
    { silent: true },
  );
  let exited = false;
  child.once("exit", () => (exited = true));
  try {
    await waitFor(
      async () => {
        if (exited) throw new Error("stopped");
        return ping(socket);
      },
      { timeoutMs: 60_000, intervalMs: 200, what: "MariaDB to accept connections" },
    );
  } catch (error) {
    const tail = existsSync(errorLog) ? readFileSync(errorLog, "utf8").split("\n").slice(-15).join("\n") : "";
    throw new Error(`MariaDB did not start on port ${port}: ${error.message}\n${tail}`);
  }
  if (exited) throw new Error(`MariaDB exited at start (port ${port} taken?). See ${errorLog}`);

  const stop = async () => {
    if (child.exitCode !== null) return;
    const admin = which("mariadb-admin") ?? which("mysqladmin");
    await run(admin, ["--no-defaults", `--socket=${socket}`, "-uroot", "shutdown"], { quiet: true }).catch(
      () => child.kill("SIGTERM"),
    );
    await new Promise((resolve) => {
      if (child.exitCode !== null) return resolve();
      const timer = setTimeout(() => {
        child.kill("SIGKILL");
        resolve();
      }, 15_000);
      child.once("exit", () => {
        clearTimeout(timer);
        resolve();
      });
    });
  };
  return { socket, port, started: true, child, stop };
}

const ident = (name) => {
  if (!/^[A-Za-z0-9_]+$/.test(name)) throw new Error(`unsafe identifier ${name}`);
  return name;
};
const literal = (value) => `'${String(value).replace(/\\/g, "\\\\").replace(/'/g, "\\'")}'`;

/**
 * Creates the database and two accounts reachable from 127.0.0.1 only: the owner, which migrates and seeds, and
 * the app's own account, which gets its rights table by table from `grantAppPrivileges` after each migration.
 */
export async function provisionDatabase({ socket, database, user, password, owner, ownerPassword }) {
  const sql = mariadbClient(socket);
  await sql(`
    CREATE DATABASE IF NOT EXISTS ${ident(database)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    CREATE USER IF NOT EXISTS ${literal(owner)}@'127.0.0.1' IDENTIFIED BY ${literal(ownerPassword)};
    ALTER USER ${literal(owner)}@'127.0.0.1' IDENTIFIED BY ${literal(ownerPassword)};
    GRANT ALL PRIVILEGES ON ${ident(database)}.* TO ${literal(owner)}@'127.0.0.1';
    CREATE USER IF NOT EXISTS ${literal(user)}@'127.0.0.1' IDENTIFIED BY ${literal(password)};
    ALTER USER ${literal(user)}@'127.0.0.1' IDENTIFIED BY ${literal(password)};
    FLUSH PRIVILEGES;
  `);
}

/** Tables the app may read and append to, never change: the audit trail (issue: tamper-evident log). */
export const APPEND_ONLY_TABLES = ["audit_log"];
/** Tables the app may only read: the audit chain head, which moves only when an entry is appended (a trigger). */
export const READ_ONLY_TABLES = ["audit_head"];

/** The rights the app's account gets on one table. */
export function appTableRights(table) {
  if (READ_ONLY_TABLES.includes(table)) return "SELECT";
  if (APPEND_ONLY_TABLES.includes(table)) return "SELECT, INSERT";
  return "SELECT, INSERT, UPDATE, DELETE";
}

/**
 * Gives the app's account exactly what it needs, table by table: read and write everywhere, but only read and
 * insert on the append-only tables, and no schema changes at all (the owner migrates). Run after migrating.
 */
export async function grantAppPrivileges({ socket, database, user }) {
  const sql = mariadbClient(socket);
  const tables = (
    await sql(
      `SELECT table_name FROM information_schema.tables WHERE table_schema = ${literal(database)} AND table_type = 'BASE TABLE';`,
    )
  )
    .split("\n")
    .map((t) => t.trim())
    .filter(Boolean);
  const account = `${literal(user)}@'127.0.0.1'`;
  const grants = tables.map(
    (table) => `GRANT ${appTableRights(table)} ON ${ident(database)}.${ident(table)} TO ${account};`,
  );
  // Stored procedures (the audit append) run with their definer's rights: the app may call them, nothing more.
  grants.push(`GRANT EXECUTE ON ${ident(database)}.* TO ${account};`);
  await sql(`REVOKE ALL PRIVILEGES, GRANT OPTION FROM ${account};\n${grants.join("\n")}\nFLUSH PRIVILEGES;`);
}
