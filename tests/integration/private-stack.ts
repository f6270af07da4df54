// A whole stack of its own for the fault and two-instance tests: a private MariaDB (migrated and seeded with the
// demo), a private mail fake and `next start` processes of the existing build, all on free loopback ports in a
// temporary folder. These tests kill and stop things; the shared server `npm test` runs must never be touched.
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import mariadb from "mariadb";
import { expect } from "vitest";
import { freePort, ROOT, type Client } from "./helpers";
// @ts-expect-error plain ES module without types
import { startMariadb } from "../../scripts/lib/mariadb.mjs";
// @ts-expect-error plain ES module without types
import { newSecret, startDatabase, startMailFakeProcess } from "../../scripts/lib/stack.mjs";

type Stoppable = { stop: () => Promise<void> };
type Db = Stoppable & { socket: string; child: ChildProcess };

export interface AppProcess {
  url: string;
  port: number;
  child: ChildProcess;
  /** Every line the server wrote (stdout and stderr), for checks on what it logs. */
  lines: string[];
  stop: () => Promise<void>;
}

export interface PrivateStack {
  tmp: string;
  dbPort: number;
  smtpPort: number;
  inboxUrl: string;
  /** The environment an app process needs (the app's own account, this stack's database and mail fake). */
  appEnv: Record<string, string>;
  root: <T = Record<string, unknown>>(sql: string, params?: unknown[]) => Promise<T[]>;
  startApp: (extraEnv?: Record<string, string>) => Promise<AppProcess>;
  /** `kill -9` of mariadbd: no shutdown, InnoDB recovers from its redo log at the next start. */
  killDb: () => Promise<void>;
  /** Starts mariadbd again on the same data folder and port. */
  restartDb: () => Promise<void>;
  /** SIGSTOP / SIGCONT of mariadbd: connections are accepted by the kernel, nothing answers. */
  freezeDb: () => void;
  thawDb: () => void;
  stopMail: () => Promise<void>;
  startMail: () => Promise<void>;
  /** Mails the fake has accepted. */
  inbox: () => Promise<{ id: number; messageId: string | null; to: string[]; subject: string }[]>;
  stop: () => Promise<void>;
}

function waitExit(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.once("exit", () => resolve());
  });
}

export async function startPrivateStack(label: string, options: { pollMs?: number } = {}): Promise<PrivateStack> {
  const tmp = mkdtempSync(path.join(os.tmpdir(), `gl-${label}-`));
  const [dbPort, smtpPort, inboxPort] = [await freePort(), await freePort(), await freePort()];
  const baseDir = path.join(tmp, "db");
  const apps: AppProcess[] = [];
  let db: Db | null = null;
  let mail: Stoppable | null = null;

  const stop = async () => {
    await Promise.all(apps.map((a) => a.stop()));
    await mail?.stop().catch(() => {});
    if (db) {
      if (db.child.signalCode === null && db.child.exitCode === null) db.child.kill("SIGCONT");
      await db.stop().catch(() => {});
    }
    rmSync(tmp, { recursive: true, force: true });
  };

  try {
    const started = await startDatabase({
      baseDir,
      port: dbPort,
      database: "greaseledger_faults",
      password: newSecret(),
      ownerPassword: newSecret(),
      reuse: false,
      seed: true,
    });
    db = started.db as Db;
    mail = await startMailFakeProcess({ smtpPort, httpPort: inboxPort, silent: true });
    const appEnv: Record<string, string> = {
      ...(started.env as Record<string, string>),
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: String(smtpPort),
      MAIL_INBOX_URL: `http://127.0.0.1:${inboxPort}`,
      OUTBOX_POLL_MS: String(options.pollMs ?? 300),
      OUTBOX_RELAY: "true",
      UPLOAD_DIR: path.join(tmp, "uploads"),
    };
    const socket = () => (db as Db).socket;

    const root = async <T,>(sql: string, params: unknown[] = []): Promise<T[]> => {
      const conn = await mariadb.createConnection({ socketPath: socket(), user: "root", database: appEnv.DATABASE_NAME });
      try {
        return (await conn.query(sql, params)) as T[];
      } finally {
        await conn.end();
      }
    };

    const startApp = async (extraEnv: Record<string, string> = {}): Promise<AppProcess> => {
      const port = await freePort();
      const url = `http://127.0.0.1:${port}`;
      const child = spawn(path.join(ROOT, "node_modules", ".bin", "next"), ["start", "-p", String(port), "-H", "127.0.0.1"], {
        cwd: ROOT,
        // Only what the app needs: nothing of the shared test server's database may leak in.
        env: {
          PATH: process.env.PATH ?? "",
          HOME: process.env.HOME ?? tmp,
          NODE_ENV: "production",
          NEXT_TELEMETRY_DISABLED: "1",
          APP_URL: url,
          ...appEnv,
          ...extraEnv,
        },
        stdio: ["ignore", "pipe", "pipe"],
      });
      const lines: string[] = [];
      for (const stream of [child.stdout!, child.stderr!]) {
        let buffer = "";
        stream.on("data", (chunk: Buffer) => {
          buffer += chunk.toString();
          const parts = buffer.split("\n");
          buffer = parts.pop() ?? "";
          lines.push(...parts);
          for (const line of parts) {
            // An unexpected error is always shown: it is what a failing assertion here usually comes down to.
            if (process.env.GL_TEST_VERBOSE || line.includes('"unexpected_error"')) process.stdout.write(`[${label}:${port}] ${line}\n`);
          }
        });
      }
      const app: AppProcess = {
        url,
        port,
        child,
        lines,
        stop: async () => {
          if (child.exitCode !== null || child.signalCode !== null) return;
          const timer = setTimeout(() => child.kill("SIGKILL"), 5000);
          child.kill("SIGTERM");
          await waitExit(child);
          clearTimeout(timer);
        },
      };
      apps.push(app);
      const deadline = Date.now() + 60_000;
      for (;;) {
        if (child.exitCode !== null) throw new Error(`the app on ${port} exited while starting:\n${lines.slice(-20).join("\n")}`);
        try {
          if ((await fetch(`${url}/api/v1/health`, { signal: AbortSignal.timeout(2000) })).ok) break;
        } catch {
          /* starting */
        }
        if (Date.now() > deadline) throw new Error(`the app on ${port} did not start`);
        await new Promise((r) => setTimeout(r, 200));
      }
      return app;
    };

    const killDb = async () => {
      const child = (db as Db).child;
      child.kill("SIGKILL");
      await waitExit(child);
    };
    const restartDb = async () => {
      db = (await startMariadb({ baseDir, port: dbPort, reuse: false })) as Db;
    };

    return {
      tmp,
      dbPort,
      smtpPort,
      inboxUrl: `http://127.0.0.1:${inboxPort}`,
      appEnv,
      root,
      startApp,
      killDb,
      restartDb,
      freezeDb: () => void (db as Db).child.kill("SIGSTOP"),
      thawDb: () => void (db as Db).child.kill("SIGCONT"),
      stopMail: async () => {
        await mail?.stop();
        mail = null;
      },
      startMail: async () => {
        mail = await startMailFakeProcess({ smtpPort, httpPort: inboxPort, silent: true });
      },
      inbox: async () => (await fetch(`http://127.0.0.1:${inboxPort}/messages`)).json(),
      stop,
    };
  } catch (error) {
    await stop();
    throw error;
  }
}

/** Runs `task` over `items` with at most `limit` running at once; results in input order. */
export async function pool<T, R>(items: T[], limit: number, task: (item: T, index: number) => Promise<R>): Promise<R[]> {
  const results = new Array<R>(items.length);
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(limit, items.length) }, async () => {
      while (next < items.length) {
        const index = next++;
        results[index] = await task(items[index]!, index);
      }
    }),
  );
  return results;
}

export type Outcome =
  | { kind: "ok"; status: number; body: any }
  | { kind: "fail"; status: number; body: any }
  | { kind: "unknown"; status?: number; error: string };

/**
 * One write a phone would retry, Jepsen-style: every attempt's outcome is kept. `ok` is the answer the client was
 * given (201); `fail` a definite refusal (4xx other than "in flight"); `unknown` anything after which the write may
 * or may not have happened (no answer, a broken connection, 5xx), so the client must retry with the same key.
 */
export interface KeyedWrite {
  key: string;
  path: string;
  json: Record<string, unknown>;
  attempts: Outcome[];
}

export async function attemptWrite(base: string, cookies: Map<string, string>, write: KeyedWrite, timeoutMs = 15_000): Promise<Outcome> {
  try {
    const response = await fetch(new URL(write.path, base), {
      method: "POST",
      headers: {
        origin: new URL(base).origin,
        "content-type": "application/json",
        "idempotency-key": write.key,
        cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join("; "),
      },
      body: JSON.stringify(write.json),
      signal: AbortSignal.timeout(timeoutMs),
    });
    const text = await response.text();
    let body: any = text;
    try {
      body = JSON.parse(text);
    } catch {
      /* not JSON */
    }
    if (response.status >= 200 && response.status < 300) return { kind: "ok", status: response.status, body };
    if (response.status >= 500 || response.status === 429 || body?.error?.code === "idempotency_in_flight")
      return { kind: "unknown", status: response.status, error: body?.error?.code ?? String(response.status) };
    return { kind: "fail", status: response.status, body };
  } catch (error) {
    return { kind: "unknown", error: error instanceof Error ? `${error.name}: ${error.message}` : String(error) };
  }
}

/** Retries a write with the same key until it has a definite answer or the deadline passes. */
export async function writeUntilAnswered(target: () => string, cookies: Map<string, string>, write: KeyedWrite, deadline: number) {
  for (;;) {
    const outcome = await attemptWrite(target(), cookies, write);
    write.attempts.push(outcome);
    if (outcome.kind !== "unknown" || Date.now() > deadline) return;
    await new Promise((r) => setTimeout(r, 200 + Math.random() * 200));
  }
}

export const finalOutcome = (write: KeyedWrite) => write.attempts.at(-1);

/** A catalogue grease of its own for a test (one 400 g cartridge pack), created through the API by a lead. */
export async function createTestGrease(
  lead: Client,
  grease: { code: string; name: string; supplier: string; thickener: string; baseOilType: string; viscosity40: number },
): Promise<{ greaseId: number; packId: number }> {
  const created = await lead.request("POST", "/api/v1/greases", {
    json: { ...grease, nlgiGrade: "2", packs: [{ kind: "cartridge", netMassGrams: 400 }] },
  });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  return { greaseId: created.body.id as number, packId: created.body.packs[0].id as number };
}

/** Receives one lot of a grease through the API; answers the lot's label. */
export async function receiveTestLot(
  who: Client,
  grease: { greaseId: number; packId: number },
  lot: { quantity: number; lotNumber: string; expiresOn: string; location: string },
): Promise<string> {
  const answer = await who.request("POST", "/api/v1/stock/receipts", { json: { ...grease, ...lot } });
  expect(answer.status, JSON.stringify(answer.body)).toBe(201);
  return answer.body.lot.labelCode as string;
}
