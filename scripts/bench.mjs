// `npm run bench`: measures Greaseledger against floors measured in the same run on the same machine (absolute
// times are not comparable between machines). Sets up its own MariaDB, the scale data and the production build.
// Options: --size 0.01 (fraction of the full plant), --rounds 3, --seconds 10, --smoke (tiny data, one short round).
// Every line says PASS or MISS against its target; the command exits 0 either way (it measures, it does not test).
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { hash, verify } from "@node-rs/argon2";
import mariadb from "mariadb";
import { ensureDebianPackage, ensureNodeModules, root, dbScript } from "./lib/setup.mjs";
import { newSecret, startApp, startDatabase } from "./lib/stack.mjs";
import { freePort, say } from "./lib/util.mjs";

const args = process.argv.slice(2);
const option = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const smoke = args.includes("--smoke");
const size = option("size", smoke ? 0.002 : 1);
const rounds = option("rounds", smoke ? 1 : 3);
const seconds = option("seconds", smoke ? 1 : 10);
const CONCURRENCY = 16;
const PASSWORD = "bench-password-2026";
const ARGON = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 };

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.floor((s.length - 1) / 2)] : 0;
};
const percentile = (sorted, p) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : 0;

/** Runs `op` from `concurrency` loops for `ms` milliseconds: operations per second, latency percentiles (ms), errors. */
async function load(op, { concurrency = CONCURRENCY, ms = seconds * 1000 } = {}) {
  const latencies = [];
  let errors = 0;
  const end = Date.now() + ms;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: concurrency }, async (_, worker) => {
      let i = worker;
      while (Date.now() < end) {
        const t = performance.now();
        try {
          await op(i);
          latencies.push(performance.now() - t);
        } catch {
          errors += 1;
        }
        i += concurrency;
      }
    }),
  );
  const elapsed = (performance.now() - started) / 1000;
  const sorted = latencies.sort((a, b) => a - b);
  return {
    ops: latencies.length,
    perSecond: latencies.length / elapsed,
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    errors,
  };
}

async function main() {
  await ensureNodeModules();
  await ensureDebianPackage({ binary: "mariadbd", pkg: "mariadb-server", why: "the benchmark database" });
  const tmp = mkdtempSync(path.join(os.tmpdir(), "gl-bench-"));
  const stoppers = [];
  try {
    const [dbPort, appPort] = [await freePort(), await freePort()];
    const ownerPassword = newSecret();
    const { db, env } = await startDatabase({
      baseDir: path.join(tmp, "db"),
      port: dbPort,
      database: "greaseledger_bench",
      password: newSecret(),
      ownerPassword,
      reuse: false,
      seed: false,
    });
    stoppers.push(db.stop);
    say(`loading the scale data (size ${size})…`);
    await dbScript(["scale", "--size", String(size)], {
      ...process.env,
      ...env,
      DATABASE_USER: "app_owner",
      DATABASE_PASSWORD: ownerPassword,
    });
    const conn = await mariadb.createConnection({
      socketPath: db.socket,
      user: "root",
      database: "greaseledger_bench",
    });
    const passwordHash = await hash(PASSWORD, ARGON);
    await conn.query("UPDATE app_user SET password_hash = ? WHERE email LIKE 'scale-%@example.test'", [
      passwordHash,
    ]);
    const points = await conn.query(
      "SELECT p.tag_code AS tag, p.current_grease_id AS grease FROM lube_point p WHERE p.site_id IN (SELECT site_id FROM user_site_access) ORDER BY p.id LIMIT 2000",
    );
    const greases = (await conn.query("SELECT id FROM grease ORDER BY id")).map((g) => Number(g.id));
    await conn.end();

    const app = await startApp({
      port: appPort,
      env: {
        ...env,
        APP_URL: `http://127.0.0.1:${appPort}`,
        OUTBOX_RELAY: "false",
        UPLOAD_DIR: path.join(tmp, "uploads"),
      },
      silent: true,
    });
    stoppers.push(app.stop);
    const base = `http://127.0.0.1:${appPort}`;
    const origin = { origin: base };
    const signIn = async () => {
      const r = await fetch(`${base}/api/v1/session`, {
        method: "POST",
        headers: { ...origin, "content-type": "application/json" },
        body: JSON.stringify({ email: "scale-technician@example.test", password: PASSWORD }),
      });
      if (r.status !== 200) throw new Error(`sign-in answered ${r.status}`);
      await r.arrayBuffer();
      return r.headers
        .getSetCookie()
        .map((c) => c.split(";")[0])
        .join("; ");
    };
    const cookie = await signIn();
    const get = async (p) => {
      const r = await fetch(`${base}${p}`, { headers: { cookie } });
      await r.arrayBuffer();
      if (!r.ok) throw new Error(`${p} ${r.status}`);
    };
    const scan = async (i) => {
      const point = points[i % points.length];
      const r = await fetch(`${base}/api/v1/points/${point.tag}`, { headers: { cookie } });
      if (!r.ok) throw new Error(`point ${r.status}`);
      await r.json();
      const e = await fetch(`${base}/api/v1/compatibility/evaluate`, {
        method: "POST",
        headers: { cookie, ...origin, "content-type": "application/json" },
        body: JSON.stringify({
          a: { greaseId: Number(point.grease) },
          b: { greaseId: greases[i % greases.length] },
        }),
      });
      if (!e.ok) throw new Error(`evaluate ${e.status}`);
      await e.json();
    };
    // Warm-up: the first requests compile and cache.
    await load(() => get("/api/v1/health"), { ms: 1000 });
    await load(scan, { ms: 1000 });

    const results = [];
    say(
      `B1 scan-to-verdict against the framework floor, ${rounds} round(s) of ${seconds} s at concurrency ${CONCURRENCY}…`,
    );
    const floor = [];
    const b1 = [];
    for (let r = 0; r < rounds; r++) {
      floor.push(await load(() => get("/api/v1/health")));
      b1.push(await load(scan));
    }
    const m = (runs, k) => median(runs.map((x) => x[k]));
    const floorPerSecond = m(floor, "perSecond");
    const floorP95 = m(floor, "p95");
    const b1Ratio = m(b1, "perSecond") / floorPerSecond;
    const b1P95Ratio = m(b1, "p95") / floorP95;
    results.push({
      id: "B1",
      what: "scan-to-verdict (point by tag + mix check), throughput ÷ framework floor",
      value: b1Ratio,
      target: "≥ 0.5",
      pass: b1Ratio >= 0.5,
      detail: {
        perSecond: m(b1, "perSecond"),
        p50: m(b1, "p50"),
        p95: m(b1, "p95"),
        p99: m(b1, "p99"),
        errors: b1.reduce((n, x) => n + x.errors, 0),
        floorPerSecond,
        floorP95,
      },
    });
    results.push({
      id: "B1-p95",
      what: "scan-to-verdict p95 ÷ framework floor p95",
      value: b1P95Ratio,
      target: "≤ 2",
      pass: b1P95Ratio <= 2,
      detail: { p95: m(b1, "p95"), floorP95 },
    });

    say("B6 sign-in against raw argon2id verifications…");
    const raw = [];
    const signIns = [];
    for (let r = 0; r < rounds; r++) {
      raw.push(await load(() => verify(passwordHash, PASSWORD), { concurrency: 2 }));
      signIns.push(await load(() => signIn(), { concurrency: 4 }));
    }
    const b6 = m(signIns, "perSecond") / m(raw, "perSecond");
    results.push({
      id: "B6",
      what: "sign-ins per second ÷ raw argon2id verifications per second",
      value: b6,
      target: "≥ 0.7",
      pass: b6 >= 0.7,
      detail: {
        signInsPerSecond: m(signIns, "perSecond"),
        verifiesPerSecond: m(raw, "perSecond"),
        errors: signIns.reduce((n, x) => n + x.errors, 0),
      },
    });

    say("B7 first-load JavaScript of the scan and catalogue pages…");
    const weigh = async (p) => {
      const html = await (await fetch(`${base}${p}`, { headers: { cookie } })).text();
      const sources = [...new Set([...html.matchAll(/<script[^>]+src="([^"]+)"/g)].map((x) => x[1]))];
      let bytes = 0;
      for (const src of sources)
        bytes += gzipSync(Buffer.from(await (await fetch(new URL(src, base))).arrayBuffer())).length;
      return bytes / 1024;
    };
    const scanKb = await weigh("/scan");
    const catalogueKb = await weigh("/catalogue");
    results.push({
      id: "B7-scan",
      what: "first-load JS of /scan, kB gzip",
      value: scanKb,
      target: "≤ 180",
      pass: scanKb <= 180,
    });
    results.push({
      id: "B7-catalogue",
      what: "first-load JS of /catalogue, kB gzip",
      value: catalogueKb,
      target: "≤ 250",
      pass: catalogueKb <= 250,
    });

    console.log("");
    console.log(
      `Greaseledger benchmark — size ${size}, ${rounds} round(s) × ${seconds} s, ${os.cpus().length} cores`,
    );
    for (const r of results)
      console.log(
        `  ${r.pass ? "PASS" : "MISS"}  ${r.id.padEnd(13)} ${r.value.toFixed(2).padStart(8)}  (target ${r.target})  ${r.what}`,
      );
    console.log("  Not measured yet: B2 (flat with history), B3 (due list), B4 (export), B5 (stock issue).");
    const out = path.join(root, "bench");
    mkdirSync(out, { recursive: true });
    writeFileSync(
      path.join(out, smoke ? "results-smoke.json" : "results.json"),
      `${JSON.stringify({ at: new Date().toISOString(), size, rounds, seconds, cores: os.cpus().length, results }, null, 2)}\n`,
    );
    say(`written to bench/${smoke ? "results-smoke.json" : "results.json"}`);
  } finally {
    for (const stop of stoppers.reverse()) await stop().catch(() => {});
    rmSync(tmp, { recursive: true, force: true });
  }
}

main().then(
  () => process.exit(0),
  (error) => {
    console.error(`[greaseledger] the benchmark could not run: ${error.message}`);
    process.exit(1);
  },
);
