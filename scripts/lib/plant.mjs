// A throwaway plant for `npm run bench` and `npm run soak`: its own MariaDB filled with the scale data, and an app
// process serving it; plus an HTTP client signed in as one of the scale users.
import path from "node:path";
import mariadb from "mariadb";
import { send } from "./http-client.mjs";
import { dbScript } from "./setup.mjs";
import { newSecret, startApp, startDatabase } from "./stack.mjs";
import { freePort, say } from "./util.mjs";

/**
 * One database with the scale data at `fraction`, and an app process serving it. Every scale user's password is
 * set to `passwordHash`. `appEnv` adds to (or overrides) the app's environment; the outbox relay is off unless set.
 */
export async function plant({ tmp, name, fraction, stoppers, passwordHash, appEnv = {} }) {
  const [dbPort, appPort] = [await freePort(), await freePort()];
  const ownerPassword = newSecret();
  const database = `greaseledger_bench`;
  const { db, env } = await startDatabase({
    baseDir: path.join(tmp, `db-${name}`),
    port: dbPort,
    database,
    password: newSecret(),
    ownerPassword,
    reuse: false,
    seed: false,
  });
  stoppers.push(db.stop);
  say(`loading the scale data for the ${name} plant (size ${fraction})…`);
  await dbScript(["scale", "--size", String(fraction)], {
    ...process.env,
    ...env,
    DATABASE_USER: "app_owner",
    DATABASE_PASSWORD: ownerPassword,
  });
  const rootConn = await mariadb.createConnection({
    socketPath: db.socket,
    user: "root",
    database,
    bigIntAsNumber: true,
    decimalAsNumber: true,
  });
  stoppers.push(() => rootConn.end());
  await rootConn.query("UPDATE app_user SET password_hash = ? WHERE email LIKE 'scale-%@example.test'", [
    passwordHash,
  ]);
  await rootConn.query("ANALYZE TABLE lube_point, service_record, stock_lot, stock_movement, grease");
  const app = await startApp({
    port: appPort,
    env: {
      ...env,
      APP_URL: `http://127.0.0.1:${appPort}`,
      OUTBOX_RELAY: "false",
      UPLOAD_DIR: path.join(tmp, `uploads-${name}`),
      ...appEnv,
    },
    silent: true,
  });
  stoppers.push(app.stop);
  return { base: `http://127.0.0.1:${appPort}`, env, rootConn, pid: app.child.pid, dbPid: db.child?.pid };
}

/** An HTTP client signed in as one of the scale users (`scale-<who>@example.test`), on `send` (./http-client.mjs). */
export async function client(base, who, password) {
  const origin = base;
  const signIn = async (email = `scale-${who}@example.test`) => {
    const r = await send(`${base}/api/v1/session`, {
      method: "POST",
      headers: { origin, "content-type": "application/json" },
      body: JSON.stringify({ email, password }),
    });
    if (r.status !== 200) throw new Error(`sign-in answered ${r.status}`);
    return r.setCookies.map((c) => c.split(";")[0]).join("; ");
  };
  const cookie = await signIn();
  const request = async (p, { method = "GET", body, headers = {}, expect = [200] } = {}) => {
    const r = await send(`${base}${p}`, {
      method,
      headers: {
        cookie,
        ...(method !== "GET" ? { origin } : {}),
        ...(body ? { "content-type": "application/json" } : {}),
        ...headers,
      },
      body: body ? JSON.stringify(body) : undefined,
    });
    if (!expect.includes(r.status))
      throw new Error(`${method} ${p} answered ${r.status}: ${r.text.slice(0, 200)}`);
    if (!r.text) return null;
    return /json/.test(r.headers["content-type"] ?? "") ? JSON.parse(r.text) : r.text;
  };
  return { signIn, request, cookie };
}
