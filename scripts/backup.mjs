// `npm run db:backup [-- --keep N] [--dir folder]`: a consistent dump of the app's database, gzip'd, with a manifest.
// `npm run db:restore [-- file] [--dir folder]`: restores the newest backup (or the file named) after checking it.
// The server is the one `DATABASE_ROOT_SOCKET` points at (root over its Unix socket), else the private server of
// `npm start` under .data/mariadb, started for the occasion when it is not running. The database is DATABASE_NAME
// (default greaseledger); backups go to BACKUP_DIR (default ./backups).
import { existsSync } from "node:fs";
import path from "node:path";
import { BackupError, backupDatabase, restoreDatabase } from "./lib/backup.mjs";
import { socketPath, startMariadb } from "./lib/mariadb.mjs";
import { ensureDebianPackage, root } from "./lib/setup.mjs";
import { say } from "./lib/util.mjs";

const USAGE = `usage:
  npm run db:backup [-- --keep N] [--dir folder]
  npm run db:restore [-- file.sql.gz] [--dir folder]`;

function parseArgs(argv) {
  const [command, ...rest] = argv;
  const options = { command, positional: [] };
  for (let i = 0; i < rest.length; i++) {
    const arg = rest[i];
    if (arg === "--dir" || arg === "--keep") {
      const value = rest[++i];
      if (value === undefined) throw new BackupError(`${arg} needs a value.\n${USAGE}`);
      options[arg.slice(2)] = value;
    } else if (arg.startsWith("--")) {
      throw new BackupError(`Unknown option ${arg}.\n${USAGE}`);
    } else {
      options.positional.push(arg);
    }
  }
  if (command !== "backup" && command !== "restore") throw new BackupError(USAGE);
  if (options.keep !== undefined) {
    if (command !== "backup") throw new BackupError("--keep belongs to db:backup.");
    if (!/^\d+$/.test(options.keep) || Number(options.keep) < 1)
      throw new BackupError(
        `--keep is how many backups to keep, a whole number of at least 1 (got "${options.keep}").`,
      );
    options.keep = Number(options.keep);
  }
  if (options.positional.length > (command === "restore" ? 1 : 0))
    throw new BackupError(`Too many arguments: ${options.positional.join(" ")}.\n${USAGE}`);
  return options;
}

/** The server to work on, and how to let go of it afterwards. */
async function connect(command) {
  if (process.env.DATABASE_ROOT_SOCKET)
    return { socket: process.env.DATABASE_ROOT_SOCKET, private: false, stop: async () => {} };
  await ensureDebianPackage({ binary: "mariadbd", pkg: "mariadb-server", why: "the database" });
  const baseDir = path.join(root, ".data", "mariadb");
  if (command === "backup" && !existsSync(path.join(baseDir, "data", "mysql")))
    throw new BackupError(
      "There is no private database in .data/mariadb yet (run npm start once), and DATABASE_ROOT_SOCKET is not set.",
    );
  const server = await startMariadb({
    baseDir,
    port: Number(process.env.DATABASE_PORT ?? 3307),
    reuse: true,
    log: say,
  });
  if (server.started)
    say(`started the private MariaDB on ${socketPath(baseDir)} for this; it stops again afterwards`);
  return { ...server, private: true };
}

/** A path as the reader typed it: relative to where they are when it is below, else in full. */
const shown = (file) => {
  const relative = path.relative(process.cwd(), file);
  return relative && !relative.startsWith("..") ? relative : file;
};

const size = (bytes) =>
  bytes >= 1024 * 1024
    ? `${(bytes / 1024 / 1024).toFixed(1)} MB`
    : `${Math.max(1, Math.round(bytes / 1024))} kB`;

let exitCode = 0;
let server = null;
try {
  const options = parseArgs(process.argv.slice(2));
  await ensureDebianPackage({ binary: "mariadb-dump", pkg: "mariadb-client", why: "backups" });
  const database = process.env.DATABASE_NAME ?? "greaseledger";
  const dir = path.resolve(options.dir ?? process.env.BACKUP_DIR ?? path.join(root, "backups"));
  server = await connect(options.command);
  if (options.command === "backup") {
    const { file, manifest, removed } = await backupDatabase({
      socket: server.socket,
      database,
      dir,
      keep: options.keep,
      log: say,
    });
    const tables = Object.values(manifest.tables);
    const rows = tables.reduce((n, t) => n + t.rows, 0);
    say(
      `backup written: ${shown(file)} (${size(manifest.bytes)}; ${tables.length} tables, ` +
        `${rows} rows; snapshot at ${manifest.snapshotAt}${manifest.auditHead ? `; audit head ${manifest.auditHead.seq}` : ""}` +
        `${manifest.binlog ? `; binary log ${manifest.binlog.file} at ${manifest.binlog.position}` : ""})`,
    );
    if (removed.length) say(`removed older backups (--keep ${options.keep}): ${removed.join(", ")}`);
  } else {
    const result = await restoreDatabase({
      socket: server.socket,
      database,
      dir,
      file: options.positional[0],
      appUser: process.env.DATABASE_USER ?? "app",
      ownerUser: process.env.DATABASE_OWNER_USER ?? "app_owner",
      log: say,
    });
    say(
      `restored ${path.basename(result.file)} into ${database}: the data as it was at ${result.manifest.snapshotAt}` +
        (result.manifest.auditHead ? `, audit head ${result.manifest.auditHead.seq}` : ""),
    );
    if (result.previous)
      say(`the tables as they were before the restore are kept in ${result.previous} until the next restore`);
    for (const warning of result.warnings)
      say(
        `warning: ${warning}; writes to the tables with triggers (the audit trail) fail until that is put right` +
          (server.private ? " (npm start sets up its accounts and their rights)" : ""),
      );
    if (!result.granted)
      say(
        `note: the app's account does not exist on this server yet${server.private ? "; npm start creates it" : ""}`,
      );
    if (server.private) say("the next npm start applies any migration newer than the backup");
  }
} catch (error) {
  console.error(
    `[greaseledger] ${error instanceof BackupError ? error.message : `failed: ${error.message}`}`,
  );
  exitCode = 1;
} finally {
  await server?.stop().catch(() => {});
}
process.exit(exitCode);
