// Brings up the whole stack for `npm start` and `npm test`: MariaDB, the schema, the mail fake, the app.
import { randomBytes } from "node:crypto";
import path from "node:path";
import { grantAppPrivileges, provisionDatabase, startMariadb } from "./mariadb.mjs";
import { dbScript, ensureBuild, root } from "./setup.mjs";
import { say, startChild, stopChild, waitFor, waitForHttp } from "./util.mjs";

export const newSecret = () => randomBytes(18).toString("base64url");

/**
 * Starts MariaDB under `baseDir`, creates the database and its two accounts, migrates and seeds as the owner, then
 * grants the app's account its table rights. Returns the env for the app (the app's account, never the owner).
 */
export async function startDatabase({ baseDir, port, database, password, ownerPassword, reuse, seed }) {
  const db = await startMariadb({ baseDir, port, reuse, log: say });
  await provisionDatabase({
    socket: db.socket,
    database,
    user: "app",
    password,
    owner: "app_owner",
    ownerPassword,
  });
  const env = {
    DATABASE_HOST: "127.0.0.1",
    DATABASE_PORT: String(port),
    DATABASE_NAME: database,
    DATABASE_USER: "app",
    DATABASE_PASSWORD: password,
  };
  const ownerEnv = { ...process.env, ...env, DATABASE_USER: "app_owner", DATABASE_PASSWORD: ownerPassword };
  await dbScript(["migrate"], ownerEnv);
  if (seed) await dbScript(["seed", "--if-empty"], ownerEnv);
  await grantAppPrivileges({ socket: db.socket, database, user: "app" });
  return { db, env, ownerEnv: { DATABASE_OWNER_USER: "app_owner", DATABASE_OWNER_PASSWORD: ownerPassword } };
}

/** Starts the mail fake as its own process and waits for its inbox to answer. */
export async function startMailFakeProcess({ smtpPort, httpPort, silent = false }) {
  const child = startChild(
    "mail",
    process.execPath,
    [
      path.join(root, "scripts", "mail-fake.mjs"),
      "--smtp-port",
      String(smtpPort),
      "--http-port",
      String(httpPort),
    ],
    { cwd: root, silent },
  );
  await waitForHttp(`http://127.0.0.1:${httpPort}/messages`, { timeoutMs: 15_000 });
  return { child, stop: () => stopChild(child) };
}

/** Builds when needed and serves the app with `next start`, waiting until it answers. */
export async function startApp({ env, port, dev = false, silent = false }) {
  const fullEnv = {
    ...process.env,
    ...env,
    NEXT_TELEMETRY_DISABLED: "1",
    NODE_ENV: dev ? "development" : "production",
  };
  if (!dev) await ensureBuild(fullEnv);
  const next = path.join(root, "node_modules", ".bin", "next");
  const child = startChild("app", next, [dev ? "dev" : "start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: root,
    env: fullEnv,
    silent,
  });
  let exited = false;
  child.once("exit", () => (exited = true));
  await waitFor(
    async () => {
      if (exited) throw new Error("the app process exited");
      const response = await fetch(`http://127.0.0.1:${port}/api/v1/health`, {
        signal: AbortSignal.timeout(3000),
      });
      return response.ok;
    },
    { timeoutMs: dev ? 120_000 : 60_000, intervalMs: 250, what: "the app to answer" },
  ).catch((error) => {
    if (exited) throw new Error(`The app stopped while starting (port ${port} in use?)`);
    throw error;
  });
  return { child, stop: () => stopChild(child, 10_000) };
}
