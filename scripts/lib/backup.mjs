// Logical backups of one database and their restore: a gzip'd `mariadb-dump` taken inside one consistent snapshot,
// with a manifest (the file's SHA-256, every table's row count and CHECKSUM TABLE value, the audit chain head), and
// a restore that loads into a staging database, checks it against the manifest and only then swaps it in.
// Node built-ins only, like the other scripts/lib helpers; it talks to MariaDB as root through its Unix socket.
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import {
  createReadStream,
  createWriteStream,
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
} from "node:fs";
import { rename, rm, stat, writeFile } from "node:fs/promises";
import path from "node:path";
import { PassThrough, Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { createGunzip, createGzip } from "node:zlib";
import { appTableRights } from "./mariadb.mjs";
import { which } from "./util.mjs";

/** A refusal or failure with a plain message for the person running the command (no stack trace needed). */
export class BackupError extends Error {
  name = "BackupError";
}

export const MANIFEST_FORMAT = 1;
const SYSTEM_DATABASES = new Set(["mysql", "information_schema", "performance_schema", "sys"]);
// The working databases are named after the target; 64 characters is MariaDB's limit for a name.
const SUFFIX = { check: "_backup_check", staging: "_restoring", previous: "_pre_restore" };
const MAX_NAME = 64 - Math.max(...Object.values(SUFFIX).map((s) => s.length));

function checkName(database) {
  if (typeof database !== "string" || !/^[A-Za-z0-9_]+$/.test(database))
    throw new BackupError(`The database name "${database}" may hold only letters, digits and _.`);
  if (database.length > MAX_NAME)
    throw new BackupError(
      `The database name ${database} is too long for a backup or restore (at most ${MAX_NAME} characters).`,
    );
  if (SYSTEM_DATABASES.has(database.toLowerCase()))
    throw new BackupError(
      `${database} is one of MariaDB's own databases; back up the app's database instead.`,
    );
  return database;
}

const id = (name) => {
  if (!/^[A-Za-z0-9_]+$/.test(name)) throw new Error(`unsafe name ${name}`);
  return `\`${name}\``;
};
const lit = (value) => `'${String(value).replace(/\\/g, "\\\\").replace(/'/g, "\\'")}'`;

/**
 * Runs a program; `input` is a string or a readable stream for its stdin, `stdout` a function that consumes its
 * output (else it is collected). Resolves with the output; rejects with the program's own error message.
 */
function exec(command, args, { input, stdout } = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: [input === undefined ? "ignore" : "pipe", "pipe", "pipe"] });
    let out = "";
    let err = "";
    // A failing input (a broken gzip stream) stops the program, so a half-read script is never taken as complete.
    let inputError = null;
    if (input !== undefined) {
      pipeline(typeof input === "string" ? Readable.from([input]) : input, child.stdin).catch((error) => {
        inputError = error;
        child.kill("SIGTERM");
      });
    }
    const reading = stdout
      ? stdout(child.stdout)
      : (child.stdout.on("data", (d) => (out += d)), Promise.resolve());
    child.stderr.on("data", (d) => (err += d));
    child.on("error", reject);
    child.on("close", async (code) => {
      let readError = null;
      await reading.catch((error) => (readError = error));
      const message = err.trim().split("\n").slice(-3).join(" ").trim();
      if (code === 0 && !inputError && !readError) resolve(out);
      // The program's own complaint says most (an SQL error stops the client, and its input then breaks too).
      else if (code && message) reject(new Error(message));
      else
        reject(
          inputError ?? readError ?? new Error(message || `${path.basename(command)} exited with ${code}`),
        );
    });
  });
}

function tool(...names) {
  for (const name of names) {
    const found = which(name);
    if (found) return found;
  }
  throw new BackupError(`${names[0]} is missing: install Debian's mariadb-client package.`);
}

/**
 * A root session over the server's socket: `sql(statements, database?)` gives the rows as arrays of strings.
 * `unlogged`: its writes stay out of the binary log, so a throwaway copy never reaches a replica.
 */
export function rootSql(socket, { unlogged = false } = {}) {
  const client = tool("mariadb", "mysql");
  const base = [
    "--no-defaults",
    `--socket=${socket}`,
    "-uroot",
    "--batch",
    "--skip-column-names",
    "--default-character-set=utf8mb4",
    ...(unlogged ? ["--init-command=SET SESSION sql_log_bin = 0"] : []),
  ];
  const sql = async (statements, database) => {
    const out = await exec(client, [...base, ...(database ? [database] : [])], { input: statements });
    return out
      .split("\n")
      .filter((line) => line !== "")
      .map((line) => line.split("\t"));
  };
  /** Loads an SQL script (a stream) into `database`. */
  sql.load = (stream, database) => exec(client, [...base, database], { input: stream });
  return sql;
}

async function databaseExists(sql, database) {
  return (
    (await sql(`SELECT 1 FROM information_schema.schemata WHERE schema_name = ${lit(database)}`)).length > 0
  );
}

async function baseTables(sql, database) {
  return (
    await sql(
      `SELECT table_name FROM information_schema.tables WHERE table_schema = ${lit(database)} AND table_type = 'BASE TABLE' ORDER BY table_name`,
    )
  ).map(([name]) => name);
}

/** Every table's row count and CHECKSUM TABLE value. */
export async function tableStats(sql, database) {
  const tables = await baseTables(sql, database);
  const stats = {};
  if (!tables.length) return stats;
  const qualified = tables.map((t) => `${id(database)}.${id(t)}`);
  const counts = await sql(
    tables.map((t, i) => `SELECT ${lit(t)}, COUNT(*) FROM ${qualified[i]}`).join(" UNION ALL "),
  );
  for (const [table, rows] of counts) stats[table] = { rows: Number(rows), checksum: null };
  for (const [name, checksum] of await sql(`CHECKSUM TABLE ${qualified.join(", ")} EXTENDED`)) {
    const table = name.slice(database.length + 1);
    if (stats[table]) stats[table].checksum = checksum === "NULL" ? null : checksum;
  }
  return stats;
}

async function facts(sql, database, tables) {
  const [[version]] = await sql("SELECT VERSION()");
  let auditHead = null;
  if (tables.includes("audit_head")) {
    const [row] = await sql(`SELECT seq, hash FROM ${id(database)}.audit_head WHERE id = 1`);
    if (row) auditHead = { seq: Number(row[0]), hash: row[1] };
  }
  let lastMigration = null;
  if (tables.includes("schema_migration")) {
    const [row] = await sql(`SELECT MAX(name) FROM ${id(database)}.schema_migration`);
    lastMigration = row?.[0] === "NULL" ? null : (row?.[0] ?? null);
  }
  return { serverVersion: version, auditHead, lastMigration };
}

async function sha256(file) {
  const hash = createHash("sha256");
  await pipeline(createReadStream(file), hash);
  return hash.digest("hex");
}

const gunzipped = (file) => createReadStream(file).pipe(createGunzip());

const stampOf = (date) =>
  date
    .toISOString()
    .replace(/[-:]/g, "")
    .replace(/\.\d+Z$/, "Z");

/** The backups in `dir` that have a manifest, newest first. */
export function listBackups(dir, database) {
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((name) => name.endsWith(".json"))
    .map((name) => {
      try {
        const manifest = JSON.parse(readFileSync(path.join(dir, name), "utf8"));
        return { manifestFile: path.join(dir, name), file: path.join(dir, manifest.file), manifest };
      } catch {
        return null;
      }
    })
    .filter(
      (b) =>
        b &&
        b.manifest.format === MANIFEST_FORMAT &&
        typeof b.manifest.snapshotAt === "string" &&
        (!database || b.manifest.database === database),
    )
    .sort((a, b) => b.manifest.snapshotAt.localeCompare(a.manifest.snapshotAt));
}

const manifestPathOf = (file) => file.replace(/\.sql\.gz$/, "") + ".json";

/**
 * Writes `<dir>/<database>-<UTC time>.sql.gz` and its manifest `<…>.json`. The dump runs in one transaction with
 * a consistent snapshot (`--single-transaction`), so the app keeps working and the file holds one moment of the
 * database. The file is then loaded into a scratch database on the same server, and the manifest records what that
 * copy holds: a backup that does not load is reported here, not on the day it is needed.
 */
export async function backupDatabase({ socket, database, dir, keep, log = () => {} }) {
  checkName(database);
  const sql = rootSql(socket);
  if (!(await databaseExists(sql, database)))
    throw new BackupError(`There is no database ${database} on this server: nothing to back up.`);
  mkdirSync(dir, { recursive: true });

  const snapshotAt = new Date();
  let base = `${database}-${stampOf(snapshotAt)}`;
  for (let n = 2; existsSync(path.join(dir, `${base}.sql.gz`)); n++)
    base = `${database}-${stampOf(snapshotAt)}-${n}`;
  const file = path.join(dir, `${base}.sql.gz`);
  const partial = `${file}.partial`;

  log(`dumping ${database} (one consistent snapshot; the app keeps running)…`);
  const dump = tool("mariadb-dump", "mysqldump");
  // With a binary log, the dump also notes the log position of its snapshot (MariaDB takes it from the snapshot
  // itself, without a global lock): the point from which a replay of the log continues after a restore.
  const [[logBin]] = await sql("SELECT @@log_bin");
  const binlog = logBin === "1";
  let head = "";
  let tail = "";
  try {
    await exec(
      dump,
      [
        "--no-defaults",
        `--socket=${socket}`,
        "-uroot",
        "--single-transaction",
        "--routines",
        "--triggers",
        "--events",
        "--hex-blob",
        "--default-character-set=utf8mb4",
        ...(binlog ? ["--master-data=2"] : []),
        database,
      ],
      {
        stdout: (out) => {
          const watch = new PassThrough();
          watch.on("data", (chunk) => {
            const text = chunk.toString("latin1");
            if (head.length < 4096) head += text.slice(0, 4096 - head.length);
            tail = (tail + text).slice(-200);
          });
          return pipeline(out, watch, createGzip({ level: 6 }), createWriteStream(partial));
        },
      },
    );
    // mariadb-dump ends every complete dump with this line; without it the dump stopped early.
    if (!tail.includes("-- Dump completed")) throw new Error("the dump ended early (no closing line)");
  } catch (error) {
    await rm(partial, { force: true });
    throw new BackupError(`The dump of ${database} failed: ${error.message}. No backup was written.`);
  }
  const digest = await sha256(partial);
  const position = /CHANGE MASTER TO MASTER_LOG_FILE='([^']+)', MASTER_LOG_POS=(\d+)/.exec(head);

  // Prove the file loads, and measure what it holds (the live tables have moved on since the snapshot).
  const check = database + SUFFIX.check;
  const scratch = rootSql(socket, { unlogged: true });
  log(`loading the dump into ${check} to check it…`);
  let tables;
  let about;
  try {
    await scratch(
      `DROP DATABASE IF EXISTS ${id(check)}; CREATE DATABASE ${id(check)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    );
    await scratch.load(gunzipped(partial), check);
    tables = await tableStats(sql, check);
    about = await facts(sql, check, Object.keys(tables));
  } catch (error) {
    await rm(partial, { force: true });
    throw new BackupError(
      `The dump of ${database} did not load back (${error.message}). No backup was written.`,
    );
  } finally {
    await scratch(`DROP DATABASE IF EXISTS ${id(check)}`).catch(() => {});
  }

  await rename(partial, file);
  const manifest = {
    format: MANIFEST_FORMAT,
    database,
    file: path.basename(file),
    bytes: (await stat(file)).size,
    sha256: digest,
    snapshotAt: snapshotAt.toISOString(),
    finishedAt: new Date().toISOString(),
    ...about,
    binlog: position ? { file: position[1], position: Number(position[2]) } : null,
    tables,
  };
  const manifestFile = manifestPathOf(file);
  await writeFile(`${manifestFile}.partial`, JSON.stringify(manifest, null, 2) + "\n");
  await rename(`${manifestFile}.partial`, manifestFile);

  const removed = [];
  if (keep !== undefined) {
    for (const old of listBackups(dir, database).slice(keep)) {
      await rm(old.file, { force: true });
      await rm(old.manifestFile, { force: true });
      removed.push(path.basename(old.file));
    }
  }
  return { file, manifestFile, manifest, removed };
}

/** Where the refusal of a damaged or unknown backup points the reader. */
const pickAnother = "Nothing was changed. Choose another backup: npm run db:restore -- <file>";

async function readBackup({ dir, file, database }) {
  if (!file) {
    const [newest] = listBackups(dir, database);
    if (!newest) {
      const others = [...new Set(listBackups(dir).map((b) => b.manifest.database))];
      throw new BackupError(
        `There is no backup of ${database} in ${dir}` +
          (others.length
            ? ` (there are backups of ${others.join(", ")}: name the file to restore one of them as ${database}).`
            : "."),
      );
    }
    file = newest.file;
  } else if (!existsSync(file) && existsSync(path.join(dir, file))) {
    file = path.join(dir, file);
  }
  file = path.resolve(file);
  if (!existsSync(file)) throw new BackupError(`The backup file ${file} does not exist.`);
  if (!file.endsWith(".sql.gz")) throw new BackupError(`${file} is not a backup (a backup ends in .sql.gz).`);
  const manifestFile = manifestPathOf(file);
  if (!existsSync(manifestFile))
    throw new BackupError(
      `${file} has no manifest next to it (${path.basename(manifestFile)}), so it cannot be checked. ${pickAnother}`,
    );
  let manifest;
  try {
    manifest = JSON.parse(readFileSync(manifestFile, "utf8"));
  } catch (error) {
    throw new BackupError(
      `The manifest ${manifestFile} is not valid JSON (${error.message}). ${pickAnother}`,
    );
  }
  if (
    manifest?.format !== MANIFEST_FORMAT ||
    typeof manifest.sha256 !== "string" ||
    typeof manifest.tables !== "object" ||
    !manifest.tables
  )
    throw new BackupError(
      `The manifest ${manifestFile} is not one this version writes (format ${MANIFEST_FORMAT}). ${pickAnother}`,
    );
  const digest = await sha256(file);
  if (digest !== manifest.sha256)
    throw new BackupError(
      `${file} is damaged: its SHA-256 is ${digest}, but the manifest recorded ${manifest.sha256} when it was written. ${pickAnother}`,
    );
  return { file, manifest };
}

/** What tells the staging copy apart from what the manifest recorded; empty when they agree. */
function differences(found, recorded, compareChecksums) {
  const problems = [];
  for (const table of Object.keys(recorded)) {
    const f = found[table];
    const r = recorded[table];
    if (!f) problems.push(`${table} is missing`);
    else if (f.rows !== r.rows) problems.push(`${table} has ${f.rows} rows, the manifest says ${r.rows}`);
    else if (compareChecksums && f.checksum !== r.checksum)
      problems.push(`${table} has checksum ${f.checksum}, the manifest says ${r.checksum}`);
  }
  for (const table of Object.keys(found))
    if (!recorded[table]) problems.push(`${table} is not in the manifest`);
  return problems;
}

/** Connections that use `database` now (the app's pool, a migration, a client), other than our own. */
async function openConnections(sql, database) {
  return (
    await sql(
      `SELECT user, COUNT(*) FROM information_schema.processlist WHERE db = ${lit(database)} AND id <> CONNECTION_ID() GROUP BY user`,
    )
  ).map(([user, n]) => `${n} of ${user}`);
}

async function refuseWhileInUse(sql, database) {
  const open = await openConnections(sql, database);
  if (open.length)
    throw new BackupError(
      `The database ${database} is in use (connections: ${open.join(", ")}). Stop the app first (Ctrl-C on npm start), then run the restore again. Nothing was changed.`,
    );
}

async function countOf(sql, query) {
  return Number((await sql(query))[0]?.[0] ?? 0);
}

/** Triggers, stored routines and events: they belong to one database and do not move with RENAME TABLE. */
function dumpObjects(socket, database) {
  return exec(tool("mariadb-dump", "mysqldump"), [
    "--no-defaults",
    `--socket=${socket}`,
    "-uroot",
    "--default-character-set=utf8mb4",
    "--no-data",
    "--no-create-info",
    "--skip-opt",
    "--triggers",
    "--routines",
    "--events",
    database,
  ]);
}

async function dropObjects(sql, database) {
  const statements = [
    ...(
      await sql(
        `SELECT trigger_name FROM information_schema.triggers WHERE trigger_schema = ${lit(database)}`,
      )
    ).map(([name]) => `DROP TRIGGER ${id(database)}.${id(name)};`),
    ...(
      await sql(
        `SELECT routine_type, routine_name FROM information_schema.routines WHERE routine_schema = ${lit(database)}`,
      )
    ).map(
      ([type, name]) => `DROP ${type === "FUNCTION" ? "FUNCTION" : "PROCEDURE"} ${id(database)}.${id(name)};`,
    ),
    ...(
      await sql(`SELECT event_name FROM information_schema.events WHERE event_schema = ${lit(database)}`)
    ).map(([name]) => `DROP EVENT ${id(database)}.${id(name)};`),
  ];
  if (statements.length) await sql(statements.join("\n"));
}

const loadText = (sql, text, database) => sql.load(Readable.from([text]), database);

/**
 * Gives the app's account its usual table rights on the restored database (those of `grantAppPrivileges`), first
 * taking away whatever it held there; its rights on other databases stay as they are.
 */
async function grantApp(sql, database, user) {
  const host = "127.0.0.1";
  if (!(await accountExists(sql, user, host))) return false;
  const account = `${lit(user)}@${lit(host)}`;
  const revokes = [
    ...(
      await sql(
        `SELECT table_name FROM mysql.tables_priv WHERE db = ${lit(database)} AND user = ${lit(user)} AND host = ${lit(host)}`,
      )
    ).map(([table]) => `REVOKE ALL PRIVILEGES ON ${id(database)}.${id(table)} FROM ${account};`),
    ...((await countOf(
      sql,
      `SELECT COUNT(*) FROM mysql.db WHERE db = ${lit(database)} AND user = ${lit(user)} AND host = ${lit(host)}`,
    ))
      ? [`REVOKE ALL PRIVILEGES ON ${id(database)}.* FROM ${account};`]
      : []),
  ];
  const grants = (await baseTables(sql, database)).map(
    (table) => `GRANT ${appTableRights(table)} ON ${id(database)}.${id(table)} TO ${account};`,
  );
  // The stored procedures (the audit append) as grantAppPrivileges gives them: EXECUTE, nothing more.
  grants.push(`GRANT EXECUTE ON ${id(database)}.* TO ${account};`);
  await sql([...revokes, ...grants, "FLUSH PRIVILEGES;"].join("\n"));
  return true;
}

/** The owner account (the one that migrates) gets all rights on the restored database, as `provisionDatabase` gives. */
async function grantOwner(sql, database, user) {
  const host = "127.0.0.1";
  if (!(await accountExists(sql, user, host))) return false;
  await sql(`GRANT ALL PRIVILEGES ON ${id(database)}.* TO ${lit(user)}@${lit(host)}; FLUSH PRIVILEGES;`);
  return true;
}

async function accountExists(sql, user, host) {
  return (
    (await countOf(
      sql,
      `SELECT COUNT(*) FROM mysql.global_priv WHERE user = ${lit(user)} AND host = ${lit(host)}`,
    )) > 0
  );
}

/**
 * A trigger runs with the rights of the account that defined it (for the audit trail, the owner that ran the
 * migrations); an account that is missing on this server or has no TRIGGER right on the database makes every write
 * to the table fail. Names each such account.
 */
async function definerProblems(sql, database) {
  const problems = [];
  const definers = await sql(
    `SELECT DISTINCT definer FROM information_schema.triggers WHERE trigger_schema = ${lit(database)}`,
  );
  for (const [definer] of definers) {
    const at = definer.lastIndexOf("@");
    const user = definer.slice(0, at);
    const host = definer.slice(at + 1);
    const grantee = `'${user}'@'${host}'`;
    if (!(await accountExists(sql, user, host))) {
      problems.push(`the triggers of ${database} run as ${definer}, which does not exist on this server`);
      continue;
    }
    const rights = await countOf(
      sql,
      `SELECT COUNT(*) FROM (SELECT grantee FROM information_schema.user_privileges WHERE privilege_type = 'TRIGGER'
         UNION ALL SELECT grantee FROM information_schema.schema_privileges WHERE privilege_type = 'TRIGGER' AND table_schema = ${lit(database)}) p
       WHERE grantee = ${lit(grantee)}`,
    );
    if (!rights)
      problems.push(`the triggers of ${database} run as ${definer}, which has no TRIGGER right on it`);
  }
  return problems;
}

/**
 * Restores a backup (the newest in `dir`, or `file`) into `database`:
 * 1. the file's SHA-256 must match its manifest, else nothing happens;
 * 2. it is loaded into `<database>_restoring`, whose row counts and table checksums must match the manifest;
 * 3. only then, in one RENAME TABLE, the current tables move to `<database>_pre_restore` (kept until the next
 *    restore) and the restored ones take their place; triggers, routines and events are re-created beside them;
 * 4. the owner account gets all rights on the database and the app's account its table rights (each if it exists);
 *    `warnings` names a trigger definer that cannot run its triggers here.
 * A failure before step 3 leaves the database as it was; step 3 itself is one atomic statement.
 */
export async function restoreDatabase({
  socket,
  database,
  dir,
  file,
  appUser = "app",
  ownerUser = "app_owner",
  log = () => {},
}) {
  checkName(database);
  const backup = await readBackup({ dir, file, database });
  const { manifest } = backup;
  log(
    `restoring ${path.basename(backup.file)} (snapshot of ${manifest.database} at ${manifest.snapshotAt}) into ${database}…`,
  );

  const sql = rootSql(socket);
  const targetExists = await databaseExists(sql, database);
  if (targetExists) {
    await refuseWhileInUse(sql, database);
    const views = await countOf(
      sql,
      `SELECT COUNT(*) FROM information_schema.views WHERE table_schema = ${lit(database)}`,
    );
    if (views)
      throw new BackupError(
        `The database ${database} has ${views} view(s); the restore moves tables only. Nothing was changed.`,
      );
  }

  const staging = database + SUFFIX.staging;
  const previous = database + SUFFIX.previous;
  let kept = null;
  // A database this restore created is dropped again when the restore does not finish.
  let created = false;
  await sql(
    `DROP DATABASE IF EXISTS ${id(staging)}; CREATE DATABASE ${id(staging)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
  );
  try {
    try {
      await sql.load(gunzipped(backup.file), staging);
    } catch (error) {
      throw new BackupError(
        `Loading ${path.basename(backup.file)} failed: ${error.message}. Nothing was changed.`,
      );
    }
    const found = await tableStats(sql, staging);
    const [[version]] = await sql("SELECT VERSION()");
    // CHECKSUM TABLE is computed the same way by one server version; across versions only the row counts count.
    const sameVersion = version === manifest.serverVersion;
    if (!sameVersion)
      log(
        `this server is ${version}, the backup was checked on ${manifest.serverVersion}: comparing row counts only`,
      );
    const problems = differences(found, manifest.tables, sameVersion);
    if (problems.length)
      throw new BackupError(
        `The restored copy does not match the manifest of ${path.basename(backup.file)}: ${problems.join("; ")}. Nothing was changed.`,
      );
    const stagingViews = await countOf(
      sql,
      `SELECT COUNT(*) FROM information_schema.views WHERE table_schema = ${lit(staging)}`,
    );
    if (stagingViews)
      throw new BackupError(
        `The backup holds ${stagingViews} view(s); the restore moves tables only. Nothing was changed.`,
      );

    // The swap. Check once more that nobody connected while the copy was loading.
    if (!targetExists) {
      await sql(`CREATE DATABASE ${id(database)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
      created = true;
    }
    await refuseWhileInUse(sql, database);
    const current = await baseTables(sql, database);
    const restored = Object.keys(found);
    const newObjects = await dumpObjects(socket, staging);
    const oldObjects = current.length ? await dumpObjects(socket, database) : "";
    if (current.length) {
      if (await databaseExists(sql, previous))
        log(`dropping ${previous}, kept from the restore before this one`);
      await sql(
        `DROP DATABASE IF EXISTS ${id(previous)}; CREATE DATABASE ${id(previous)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      );
    }
    await dropObjects(sql, staging);
    await dropObjects(sql, database);
    const moves = [
      ...current.map((t) => `${id(database)}.${id(t)} TO ${id(previous)}.${id(t)}`),
      ...restored.map((t) => `${id(staging)}.${id(t)} TO ${id(database)}.${id(t)}`),
    ];
    try {
      if (moves.length) await sql(`RENAME TABLE ${moves.join(", ")}`);
    } catch (error) {
      await loadText(sql, oldObjects, database).catch(() => {});
      throw new BackupError(`Swapping the restored tables in failed: ${error.message}. Nothing was changed.`);
    }
    try {
      await loadText(sql, newObjects, database);
    } catch (error) {
      // Put the database back as it was: tables, then its own triggers.
      await dropObjects(sql, database).catch(() => {});
      const back = [
        ...restored.map((t) => `${id(database)}.${id(t)} TO ${id(staging)}.${id(t)}`),
        ...current.map((t) => `${id(previous)}.${id(t)} TO ${id(database)}.${id(t)}`),
      ];
      if (back.length) await sql(`RENAME TABLE ${back.join(", ")}`);
      await loadText(sql, oldObjects, database);
      throw new BackupError(
        `Re-creating the triggers of the restored tables failed: ${error.message}. The database was put back as it was.`,
      );
    }
    created = false;
    if (current.length) kept = previous;
    if (oldObjects)
      await loadText(sql, oldObjects, previous).catch((error) =>
        log(`note: the triggers of ${previous} were not re-created (${error.message})`),
      );
  } finally {
    await sql(`DROP DATABASE IF EXISTS ${id(staging)}`).catch(() => {});
    if (created) await sql(`DROP DATABASE IF EXISTS ${id(database)}`).catch(() => {});
  }
  const ownerGranted = await grantOwner(sql, database, ownerUser);
  const granted = await grantApp(sql, database, appUser);
  const warnings = await definerProblems(sql, database);
  return { file: backup.file, manifest, previous: kept, granted, ownerGranted, warnings };
}
