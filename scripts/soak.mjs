// `npm run soak`: a long run at a fixed rate (not part of `npm test`). Sets up its own MariaDB with the scale data,
// the mail fake and the production app with its outbox relay, then sends a fixed mix of the work a plant does in a
// shift — scans, services, stock issues and receipts, blocked mixes (each files an incident), exports, sign-ins —
// for `--minutes`, and reports per minute: throughput, errors, p50/p99, the app's memory and the outbox lag.
// At the end it checks the stock and audit invariants and compares the last part of the run with the first.
// Options: --minutes 10, --rate 20 (operations per second), --size 0.02 (fraction of the full plant).
// Exits 1 when an operation failed unexpectedly or an invariant broke; the drift figures are reported, not enforced.
import { randomUUID } from "node:crypto";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { percentile, treeRssKb } from "./lib/bench-stats.mjs";
import { ensureDebianPackage, ensureNodeModules, root } from "./lib/setup.mjs";
import { startMailFakeProcess } from "./lib/stack.mjs";
import { freePort, say } from "./lib/util.mjs";

const args = process.argv.slice(2);
const option = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const minutes = option("minutes", 10);
const rate = option("rate", 20);
const size = option("size", 0.02);
const PASSWORD = "soak-password-2026";
const ARGON = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 };
/** Operations still running when this many are in flight are not started: counted as shed, an error. */
const MAX_IN_FLIGHT = 64;
const WINDOW_MS = 60_000;

/** A small deterministic random source (mulberry32), so two runs send the same mix. */
function random(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

// npm packages (and the modules that use them) are loaded once ensureNodeModules has installed them.
let hash, client, plant;

async function main() {
  await ensureNodeModules();
  ({ hash } = await import("@node-rs/argon2"));
  ({ client, plant } = await import("./lib/plant.mjs"));
  await ensureDebianPackage({ binary: "mariadbd", pkg: "mariadb-server", why: "the soak database" });
  const tmp = mkdtempSync(path.join(os.tmpdir(), "gl-soak-"));
  const stoppers = [];
  try {
    const [smtpPort, inboxPort] = [await freePort(), await freePort()];
    const mail = await startMailFakeProcess({ smtpPort, httpPort: inboxPort, silent: true });
    stoppers.push(mail.stop);
    const passwordHash = await hash(PASSWORD, ARGON);
    const site = await plant({
      tmp,
      name: "soak",
      fraction: size,
      stoppers,
      passwordHash,
      appEnv: {
        SMTP_HOST: "127.0.0.1",
        SMTP_PORT: String(smtpPort),
        OUTBOX_RELAY: "true",
        OUTBOX_POLL_MS: "1000",
      },
    });
    const db = site.rootConn;
    const [tech, clerk, auditor] = await Promise.all(
      ["technician", "clerk", "auditor"].map((who) => client(site.base, who, PASSWORD)),
    );

    // What the mix works on: points whose current grease is their assigned one, and the greases.
    const points = await db.query(
      `SELECT tag_code AS tag, current_grease_id AS grease FROM lube_point
       WHERE current_grease_id IS NOT NULL AND current_grease_id = assigned_grease_id ORDER BY id LIMIT 500`,
    );
    const greases = (await db.query("SELECT id FROM grease ORDER BY id")).map((g) => g.id);
    if (!points.length || greases.length < 2)
      throw new Error("the scale data has no points or greases to work on");

    // Blocked mixes: pairs the engine calls incompatible, found by asking it (each attempt files an incident).
    say("finding incompatible pairs for the blocked-mix part of the mix…");
    const blocked = [];
    for (const p of points.slice(0, 40)) {
      for (const g of greases) {
        if (g === p.grease || blocked.length >= 8) continue;
        const v = await tech.request("/api/v1/compatibility/evaluate", {
          method: "POST",
          body: { a: { greaseId: p.grease }, b: { greaseId: g } },
        });
        if (!v.mixingAllowed) {
          blocked.push({ tag: p.tag, grease: g });
          break;
        }
      }
      if (blocked.length >= 8) break;
    }

    // Stock: four greases at one store, 30 containers each, with a reorder point 5 containers under that, so that
    // issues cross it and receipts restock: reorder mail keeps flowing through the outbox.
    const [largest] = await db.query(
      "SELECT site_id AS id FROM lube_point GROUP BY site_id ORDER BY COUNT(*) DESC LIMIT 1",
    );
    const targets = await db.query(
      `SELECT gp.grease_id AS greaseId, MIN(gp.id) AS packId, CONCAT(s.code, '/', MIN(sl.code)) AS location
       FROM grease_pack gp JOIN storage_location sl ON sl.site_id = ? JOIN site s ON s.id = sl.site_id
       GROUP BY gp.grease_id, s.code ORDER BY gp.grease_id LIMIT 4`,
      [largest.id],
    );
    let lotNo = 0;
    const receive = (t, quantity) =>
      clerk.request("/api/v1/stock/receipts", {
        method: "POST",
        body: {
          greaseId: t.greaseId,
          packId: t.packId,
          quantity,
          lotNumber: `SOAK-${t.greaseId}-${++lotNo}`,
          expiresOn: "2099-12-31",
          location: t.location,
        },
        expect: [201],
      });
    for (const t of targets) {
      await receive(t, 30);
      const [{ grams }] = await db.query(
        `SELECT COALESCE(SUM(l.on_hand * p.net_mass_grams), 0) AS grams FROM stock_lot l JOIN grease_pack p ON p.id = l.pack_id
         WHERE l.site_id = ? AND l.grease_id = ?`,
        [largest.id, t.greaseId],
      );
      const [{ packGrams }] = await db.query(
        "SELECT net_mass_grams AS packGrams FROM grease_pack WHERE id = ?",
        [t.packId],
      );
      await db.query(
        `INSERT INTO stock_policy (site_id, grease_id, reorder_point_grams, safety_stock_weeks, updated_at)
         VALUES (?, ?, ?, NULL, NOW(3)) ON DUPLICATE KEY UPDATE reorder_point_grams = VALUES(reorder_point_grams)`,
        [largest.id, t.greaseId, Number(grams) - 5 * Number(packGrams)],
      );
    }

    const today = new Date();
    const monthAgo = new Date(today.getTime() - 30 * 86_400_000);
    const day = (d) => d.toISOString().slice(0, 10);
    const next = random(20261202);
    const pick = (xs) => xs[Math.floor(next() * xs.length)];
    // The mix (weights add up to 100), after reliability.md §E.3: mostly reads, a fifth stock work, some of the rest.
    const mix = [
      {
        name: "scan",
        weight: 58,
        run: async () => {
          const p = pick(points);
          await tech.request(`/api/v1/points/${p.tag}`);
          await tech.request("/api/v1/compatibility/evaluate", {
            method: "POST",
            body: { a: { greaseId: p.grease }, b: { greaseId: pick(greases) } },
          });
        },
      },
      {
        name: "service",
        weight: 10,
        run: async () => {
          const p = pick(points);
          await tech.request(`/api/v1/points/${p.tag}/services`, {
            method: "POST",
            body: { greaseId: p.grease, grams: 5 },
            headers: { "idempotency-key": randomUUID() },
            expect: [201],
          });
        },
      },
      {
        name: "issue",
        weight: 17,
        run: async () => {
          const t = pick(targets);
          // Sold out is an honest answer when issues outrun receipts.
          await tech.request("/api/v1/stock/issues", {
            method: "POST",
            body: { greaseId: t.greaseId, packId: t.packId, quantity: 1, location: t.location },
            headers: { "idempotency-key": randomUUID() },
            expect: [201, 409],
          });
        },
      },
      { name: "receipt", weight: 3, run: () => receive(pick(targets), 20) },
      {
        name: "blocked mix",
        weight: blocked.length ? 5 : 0,
        run: async () => {
          const b = pick(blocked);
          await tech.request(`/api/v1/points/${b.tag}/services`, {
            method: "POST",
            body: { greaseId: b.grease, grams: 5 },
            headers: { "idempotency-key": randomUUID() },
            expect: [409],
          });
        },
      },
      {
        name: "export",
        weight: 5,
        run: async () => {
          await auditor.request(`/api/v1/services/export?format=csv&from=${day(monthAgo)}&to=${day(today)}`);
        },
      },
      {
        name: "sign-in",
        weight: 2,
        run: async () => {
          const c = await client(site.base, pick(["technician", "clerk", "lead"]), PASSWORD);
          await c.request("/api/v1/session", { method: "DELETE", expect: [204] });
        },
      },
    ];
    const total = mix.reduce((n, m) => n + m.weight, 0);
    const choose = () => {
      let r = next() * total;
      for (const m of mix) if ((r -= m.weight) < 0) return m;
      return mix[0];
    };

    // The run: one operation every 1/rate s whatever the app does (open loop); latency counts from the planned
    // start, so a slow answer cannot hide the ones queued behind it.
    say(`soak: ${rate} operations/s for ${minutes} min against ${site.base} (size ${size})…`);
    const windows = [];
    let current = null;
    const openWindow = (index) => ({ index, latencies: [], byOp: {}, errors: 0, shed: 0, failures: [] });
    const started = performance.now();
    const endAt = started + minutes * 60_000;
    let inFlight = 0;
    let planned = started;
    const running = new Set();
    const closeWindow = async () => {
      if (!current) return;
      const sorted = current.latencies.sort((a, b) => a - b);
      const [{ pending, oldest }] = await db.query(
        "SELECT COUNT(*) AS pending, TIMESTAMPDIFF(SECOND, MIN(created_at), NOW(3)) AS oldest FROM mail_outbox WHERE status IN ('pending','sending')",
      );
      const [{ sent, lagMax }] = await db.query(
        `SELECT COUNT(*) AS sent, MAX(TIMESTAMPDIFF(MICROSECOND, created_at, sent_at)) / 1e6 AS lagMax FROM mail_outbox
         WHERE status = 'sent' AND sent_at >= NOW(3) - INTERVAL 60 SECOND`,
      );
      const w = {
        minute: current.index + 1,
        operations: sorted.length,
        perSecond: sorted.length / (WINDOW_MS / 1000),
        errors: current.errors,
        shed: current.shed,
        p50: percentile(sorted, 50),
        p99: percentile(sorted, 99),
        rssMb: treeRssKb(site.pid) / 1024,
        outboxPending: Number(pending),
        outboxOldestPendingS: oldest === null ? 0 : Number(oldest),
        mailsSent: Number(sent),
        mailLagMaxS: lagMax === null ? 0 : Number(lagMax),
        byOp: current.byOp,
        failures: current.failures.slice(0, 3),
      };
      windows.push(w);
      say(
        `minute ${w.minute}: ${w.perSecond.toFixed(1)} op/s, errors ${w.errors}, shed ${w.shed}, p50 ${w.p50.toFixed(0)} ms, ` +
          `p99 ${w.p99.toFixed(0)} ms, app ${w.rssMb.toFixed(0)} MB, outbox ${w.outboxPending} waiting (oldest ${w.outboxOldestPendingS} s), ` +
          `${w.mailsSent} sent (lag ≤ ${w.mailLagMaxS.toFixed(1)} s)`,
      );
    };
    current = openWindow(0);
    while (planned < endAt) {
      const now = performance.now();
      const index = Math.floor((now - started) / WINDOW_MS);
      if (index !== current.index) {
        await closeWindow();
        current = openWindow(index);
      }
      if (planned > now) await new Promise((r) => setTimeout(r, planned - now));
      const op = choose();
      const scheduled = planned;
      planned += 1000 / rate;
      const w = current;
      if (inFlight >= MAX_IN_FLIGHT) {
        w.shed += 1;
        w.errors += 1;
        continue;
      }
      inFlight += 1;
      const task = op
        .run()
        .then(
          () => {
            w.latencies.push(performance.now() - scheduled);
            w.byOp[op.name] = (w.byOp[op.name] ?? 0) + 1;
          },
          (error) => {
            w.errors += 1;
            w.failures.push(`${op.name}: ${String(error.message ?? error).slice(0, 160)}`);
          },
        )
        .finally(() => {
          inFlight -= 1;
          running.delete(task);
        });
      running.add(task);
    }
    await Promise.all(running);
    await closeWindow();

    // Let the relay catch up, then the invariants.
    say("waiting for the outbox to drain…");
    let drainedAfter = null;
    for (let s = 0; s < 120; s++) {
      const [{ pending }] = await db.query(
        "SELECT COUNT(*) AS pending FROM mail_outbox WHERE status IN ('pending','sending')",
      );
      if (Number(pending) === 0) {
        drainedAfter = s;
        break;
      }
      await new Promise((r) => setTimeout(r, 1000));
    }
    const [{ negative }] = await db.query("SELECT COUNT(*) AS negative FROM stock_lot WHERE on_hand < 0");
    const [{ unequal }] = await db.query(
      `SELECT COUNT(*) AS unequal FROM stock_lot l
       LEFT JOIN (SELECT lot_id, SUM(quantity) AS s FROM stock_movement GROUP BY lot_id) mv ON mv.lot_id = l.id
       WHERE COALESCE(mv.s, 0) <> l.on_hand`,
    );
    const [{ dead }] = await db.query("SELECT COUNT(*) AS dead FROM mail_outbox WHERE status = 'dead'");
    const [{ lagMax }] = await db.query(
      "SELECT MAX(TIMESTAMPDIFF(MICROSECOND, created_at, sent_at)) / 1e6 AS lagMax FROM mail_outbox WHERE status = 'sent'",
    );
    const inbox = await (await fetch(`http://127.0.0.1:${inboxPort}/messages`)).json();
    const [{ queuedDuringRun }] = await db.query("SELECT COUNT(*) AS queuedDuringRun FROM mail_outbox");
    const chain = await auditor.request("/api/v1/audit/verify");

    // Drift: the last fifth of the run against the first fifth after the first minute (warm-up).
    const settled = windows.slice(1).filter((w) => w.operations > 0);
    const part = Math.max(1, Math.floor(settled.length / 5));
    const first = settled.slice(0, part);
    const last = settled.slice(-part);
    const maxOf = (ws, k) => Math.max(...ws.map((w) => w[k]));
    const rssDrift = settled.length ? maxOf(last, "rssMb") / maxOf(first, "rssMb") - 1 : 0;
    const p99Drift = settled.length ? maxOf(last, "p99") / Math.max(1, maxOf(first, "p99")) : 0;
    const errors = windows.reduce((n, w) => n + w.errors, 0);
    const operations = windows.reduce((n, w) => n + w.operations, 0);
    const inboxCount = inbox.length;
    const checks = [
      ["memory growth after warm-up < 10 %", rssDrift < 0.1, `${(rssDrift * 100).toFixed(1)} %`],
      ["p99 drift, last fifth ÷ first fifth < 1.5", p99Drift < 1.5, p99Drift.toFixed(2)],
      ["no unexpected errors", errors === 0, `${errors} of ${operations + errors}`],
      [
        "outbox lag < 60 s",
        (Number(lagMax) || 0) < 60 && drainedAfter !== null,
        `max ${Number(lagMax || 0).toFixed(1)} s, drained ${drainedAfter ?? "not"} s after the run`,
      ],
      [
        "every queued mail delivered once",
        Number(dead) === 0 && inboxCount === Number(queuedDuringRun),
        `${queuedDuringRun} queued, ${inboxCount} in the inbox, ${dead} dead`,
      ],
      [
        "stock invariants hold",
        Number(negative) === 0 && Number(unequal) === 0,
        `${negative} negative, ${unequal} ledger ≠ on hand`,
      ],
      ["audit chain intact", chain.ok === true, `${chain.checked} entries checked`],
    ];
    console.log("");
    console.log(
      `Greaseledger soak — ${minutes} min at ${rate} op/s, size ${size}, ${os.cpus().length} cores`,
    );
    for (const [what, ok, figure] of checks) console.log(`  ${ok ? "PASS" : "MISS"}  ${what}: ${figure}`);
    mkdirSync(path.join(root, "bench"), { recursive: true });
    writeFileSync(
      path.join(root, "bench", "soak.json"),
      `${JSON.stringify({ at: new Date().toISOString(), minutes, rate, size, blockedPairs: blocked.length, windows, checks }, null, 2)}\n`,
    );
    say("written to bench/soak.json");
    const hardFailures = checks.filter(([what, ok]) => !ok && !/drift|growth/.test(what));
    return hardFailures.length ? 1 : 0;
  } finally {
    for (const stop of stoppers.reverse()) await stop().catch(() => {});
    rmSync(tmp, { recursive: true, force: true });
  }
}

main().then(
  (code) => process.exit(code),
  (error) => {
    console.error(`[greaseledger] the soak could not run: ${error.stack ?? error}`);
    process.exit(1);
  },
);
