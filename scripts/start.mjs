// `npm start`: installs what is missing, starts a private MariaDB and the mail fake, migrates, seeds the
// demo into an empty database, builds when needed and serves the app. Ctrl-C stops everything it started.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { ensureDebianPackage, ensureNodeModules, root } from "./lib/setup.mjs";
import { newSecret, startApp, startDatabase, startMailFakeProcess } from "./lib/stack.mjs";
import { portInUse, say } from "./lib/util.mjs";

const dev = process.argv.includes("--dev");
const appPort = Number(process.env.PORT ?? 3000);
const dbPort = Number(process.env.DATABASE_PORT ?? 3307);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const inboxPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2526);
const dataDir = path.join(root, ".data");

const stoppers = [];
let stopping = false;
async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  say("stopping…");
  for (const stop of stoppers.reverse()) {
    await stop().catch((error) => console.error(error.message));
  }
  say("stopped");
  process.exit(code);
}
process.on("SIGINT", () => shutdown(0));
process.on("SIGTERM", () => shutdown(0));

function loadSecrets() {
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, "secrets.json");
  const secrets = existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : {};
  // A data folder from before the owner account gets its password added on the next start.
  if (!secrets.databasePassword || !secrets.ownerPassword) {
    secrets.databasePassword ??= newSecret();
    secrets.ownerPassword ??= newSecret();
    writeFileSync(file, JSON.stringify(secrets, null, 2), { mode: 0o600 });
  }
  return secrets;
}

try {
  await ensureNodeModules();
  await ensureDebianPackage({ binary: "mariadbd", pkg: "mariadb-server", why: "the database" });
  if (await portInUse(appPort)) {
    throw new Error(
      `port ${appPort} is already in use — is another \`npm start\` running? Set PORT to use another.`,
    );
  }
  const secrets = loadSecrets();
  const { db, env } = await startDatabase({
    baseDir: path.join(dataDir, "mariadb"),
    port: dbPort,
    database: process.env.DATABASE_NAME ?? "greaseledger",
    password: process.env.DATABASE_PASSWORD ?? secrets.databasePassword,
    ownerPassword: process.env.DATABASE_OWNER_PASSWORD ?? secrets.ownerPassword,
    reuse: true,
    seed: true,
  });
  stoppers.push(db.stop);

  const inboxUrl = `http://127.0.0.1:${inboxPort}`;
  if (await portInUse(inboxPort)) {
    say(`a mail fake already answers on ${inboxUrl}; using it`);
  } else {
    const mail = await startMailFakeProcess({ smtpPort, httpPort: inboxPort });
    stoppers.push(mail.stop);
  }

  const appUrl = process.env.APP_URL ?? `http://localhost:${appPort}`;
  const app = await startApp({
    port: appPort,
    dev,
    env: {
      ...env,
      APP_URL: appUrl,
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(smtpPort),
      MAIL_INBOX_URL: inboxUrl,
    },
  });
  stoppers.push(app.stop);
  app.child.once("exit", (code) => {
    if (!stopping) {
      say(`the app exited (${code}); stopping the rest`);
      shutdown(1);
    }
  });

  console.log(`
  Greaseledger is running.

    App:         ${appUrl}
    Mail inbox:  ${inboxUrl}   (every mail the app sends lands here; nothing leaves this machine)
    Database:    MariaDB on 127.0.0.1:${dbPort}, data in .data/mariadb

  Demo sign-ins (password for all: demo-grease-2026)
    admin@example.com     administrator
    lead@example.com      lubrication lead
    clerk@example.com     storeroom clerk
    tech@example.com      lubrication technician
    auditor@example.com   auditor

  Press Ctrl-C to stop.
`);
} catch (error) {
  console.error(`\n[greaseledger] could not start: ${error.message}\n`);
  await shutdown(1);
}
