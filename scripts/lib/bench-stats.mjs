// Measurement helpers for `npm run bench`: closed-loop load with latency percentiles, medians, process memory.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";

export const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.floor((s.length - 1) / 2)] : 0;
};

export const percentile = (sorted, p) =>
  sorted.length
    ? sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]
    : 0;

/**
 * Runs `op` from `concurrency` loops for `ms` milliseconds. `op(i, lap)` may call `lap()` after each HTTP request it
 * makes, so that latency is recorded per request; otherwise one latency is recorded per call. Returns requests per
 * second, operations per second, latency percentiles (ms) and the number of failed operations.
 */
export async function load(op, { concurrency, ms }) {
  const latencies = [];
  let errors = 0;
  let operations = 0;
  const end = Date.now() + ms;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: concurrency }, async (_, worker) => {
      let i = worker;
      while (Date.now() < end) {
        let t = performance.now();
        let lapped = false;
        const lap = () => {
          const now = performance.now();
          latencies.push(now - t);
          t = now;
          lapped = true;
        };
        try {
          await op(i, lap);
          if (!lapped) latencies.push(performance.now() - t);
          operations += 1;
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
    requests: latencies.length,
    perSecond: latencies.length / elapsed,
    operationsPerSecond: operations / elapsed,
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    errors,
  };
}

/** Times `op` run one after another `n` times: the latencies in ms. */
export async function serial(op, n) {
  const out = [];
  for (let i = 0; i < n; i++) {
    const t = performance.now();
    await op(i);
    out.push(performance.now() - t);
  }
  return out;
}

/** A process and all its descendants, from `ps`: [pid, rss kB] for each. */
function processTree(pid) {
  const rows = execFileSync("ps", ["-e", "-o", "pid=,ppid=,rss="], { encoding: "utf8" })
    .trim()
    .split("\n")
    .map((l) => l.trim().split(/\s+/).map(Number));
  const wanted = new Set([pid]);
  let grew = true;
  while (grew) {
    grew = false;
    for (const [p, pp] of rows)
      if (wanted.has(pp) && !wanted.has(p)) {
        wanted.add(p);
        grew = true;
      }
  }
  return rows.filter(([p]) => wanted.has(p)).map(([p, , rss]) => [p, rss]);
}

/** Resident memory (kB) of a process and all its descendants (Linux `ps`). */
export function treeRssKb(pid) {
  return processTree(pid).reduce((kb, [, rss]) => kb + rss, 0);
}

/** Resident memory (kB) of the given processes, read from /proc (a process that ended counts 0). */
function rssKbOf(pids, pageKb) {
  let kb = 0;
  for (const p of pids) {
    try {
      kb += Number(readFileSync(`/proc/${p}/statm`, "utf8").split(" ")[1]) * pageKb;
    } catch {
      // the process ended meanwhile
    }
  }
  return kb;
}

/**
 * Samples the resident memory of a process and its descendants every `everyMs` until stopped: `stop()` gives the
 * peak in kB. The process tree is listed once, when sampling starts, and each sample reads /proc directly: running
 * `ps` for every sample took about 25 ms of this process's time, synchronously, so the client stopped reading what
 * it measured for half of every 50 ms.
 */
export function sampleRss(pid, everyMs = 50) {
  const pids = processTree(pid).map(([p]) => p);
  const pageKb = Number(execFileSync("getconf", ["PAGESIZE"], { encoding: "utf8" }).trim()) / 1024;
  let peak = rssKbOf(pids, pageKb);
  const timer = setInterval(() => {
    peak = Math.max(peak, rssKbOf(pids, pageKb));
  }, everyMs);
  return {
    stop() {
      clearInterval(timer);
      return Math.max(peak, rssKbOf(pids, pageKb));
    },
  };
}

/** CPU time (ms, user + system) used so far by a process and all its descendants (Linux /proc). */
export function treeCpuMs(pid) {
  const tick = 1000 / Number(execFileSync("getconf", ["CLK_TCK"], { encoding: "utf8" }).trim());
  let ms = 0;
  for (const [p] of processTree(pid)) {
    try {
      const stat = readFileSync(`/proc/${p}/stat`, "utf8");
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      ms += (Number(fields[11]) + Number(fields[12])) * tick; // utime, stime
    } catch {
      // the process ended meanwhile
    }
  }
  return ms;
}
