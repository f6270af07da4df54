import { spawn, type ChildProcess } from "node:child_process";
import net from "node:net";
import path from "node:path";
import mariadb from "mariadb";

/** Environment set by `npm test` (scripts/test.mjs). */
export const APP_URL = must("APP_URL");
export const ROOT = path.resolve(import.meta.dirname, "..", "..");

function must(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run the integration tests through \`npm test\``);
  return value;
}

/** A privileged connection over the throwaway server's socket (for checks the app user may not make). */
export function rootConnection(database: string | null = must("DATABASE_NAME")) {
  return mariadb.createConnection({ socketPath: must("DATABASE_ROOT_SOCKET"), user: "root", database: database ?? undefined });
}

export async function rootQuery<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
  const conn = await rootConnection();
  try {
    return (await conn.query(sql, params)) as T[];
  } finally {
    await conn.end();
  }
}

/** A tiny HTTP client that keeps cookies and sends the same-origin header a browser would. */
export class Client {
  cookies = new Map<string, string>();
  constructor(public base = APP_URL) {}

  async request(method: string, pathname: string, options: { json?: unknown; headers?: Record<string, string>; body?: string } = {}) {
    const headers: Record<string, string> = { origin: new URL(this.base).origin, ...options.headers };
    if (options.json !== undefined) headers["content-type"] ??= "application/json";
    if (this.cookies.size) headers.cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    const response = await fetch(new URL(pathname, this.base), {
      method,
      headers,
      body: options.body ?? (options.json !== undefined ? JSON.stringify(options.json) : undefined),
      redirect: "manual",
    });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const index = pair!.indexOf("=");
      const name = pair!.slice(0, index);
      const value = pair!.slice(index + 1);
      if (value === "" || /max-age=0/i.test(line)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    const text = await response.text();
    let body: unknown = null;
    try {
      body = text ? JSON.parse(text) : null;
    } catch {
      body = text;
    }
    return { status: response.status, headers: response.headers, body: body as any, text };
  }

  signIn(email: string, password = "demo-grease-2026") {
    return this.request("POST", "/api/v1/session", { json: { email, password } });
  }
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** Starts another `next start` of the same build against the same database. */
export async function startAppInstance(port: number, extraEnv: Record<string, string> = {}) {
  const child: ChildProcess = spawn(path.join(ROOT, "node_modules", ".bin", "next"), ["start", "-p", String(port), "-H", "127.0.0.1"], {
    cwd: ROOT,
    env: { ...process.env, NODE_ENV: "production", APP_URL: `http://127.0.0.1:${port}`, OUTBOX_RELAY: "false", ...extraEnv },
    stdio: "ignore",
  });
  const deadline = Date.now() + 60_000;
  for (;;) {
    try {
      const r = await fetch(`http://127.0.0.1:${port}/api/v1/health`, { signal: AbortSignal.timeout(2000) });
      if (r.ok) break;
    } catch {
      /* starting */
    }
    if (child.exitCode !== null) throw new Error("app instance exited while starting");
    if (Date.now() > deadline) throw new Error("app instance did not start");
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    url: `http://127.0.0.1:${port}`,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once("exit", () => resolve());
        child.kill("SIGTERM");
        setTimeout(() => child.kill("SIGKILL"), 5000).unref();
      }),
  };
}

/** Inserts an active user straight into the database (through the privileged connection). */
export async function createUser(input: { email: string; role: string; password?: string; name?: string; status?: string }) {
  const { hash } = await import("@node-rs/argon2");
  const { randomUUID } = await import("node:crypto");
  const id = randomUUID();
  const passwordHash = await hash(input.password ?? "a-test-password-long", { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 });
  const now = new Date();
  await rootQuery(
    `INSERT INTO app_user (id, email, name, role, status, password_hash, unit_system, created_at, updated_at)
     VALUES (?, ?, ?, ?, ?, ?, 'metric', ?, ?)`,
    [id, input.email, input.name ?? "Test Person", input.role, input.status ?? "active", passwordHash, now, now],
  );
  return { id, email: input.email, password: input.password ?? "a-test-password-long" };
}

export const uniqueEmail = (label: string) => `${label}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@example.test`;

/** Creates an empty, migrated database of its own (for tests that must not share rows with the app). */
export async function createScratchDatabase(name: string): Promise<void> {
  if (!/^[a-z0-9_]+$/.test(name)) throw new Error("bad name");
  const conn = await rootConnection(null);
  try {
    await conn.query(`DROP DATABASE IF EXISTS ${name}`);
    await conn.query(`CREATE DATABASE ${name} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await conn.query(`GRANT ALL PRIVILEGES ON ${name}.* TO 'app'@'127.0.0.1'`);
  } finally {
    await conn.end();
  }
  const { parseEnv } = await import("@/lib/env");
  const { createSequelize } = await import("@/lib/server/db");
  const { createMigrator } = await import("@/models/migrator");
  const sequelize = createSequelize(parseEnv({ ...process.env, DATABASE_NAME: name }), { poolMax: 2 });
  try {
    await createMigrator(sequelize, { info: () => {}, warn: () => {}, error: console.error }).up();
  } finally {
    await sequelize.close();
  }
}
