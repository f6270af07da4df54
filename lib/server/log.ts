import "server-only";

type Level = "info" | "warn" | "error";

/**
 * Lines of this turn of the event loop, written together when it ends. Standard output is usually a pipe, and
 * writing to a pipe is synchronous in Node on Linux: one write per line cost a busy server's one thread a system call
 * and the console's wrappers for every request it logged. An error line goes out at once (after what is waiting), and
 * whatever waits is written when the process exits. One buffer per process, even when a production build holds
 * several copies of this module (one per route bundle).
 */
const holder = globalThis as { __greaseledgerLogBuffer?: { lines: string[]; scheduled: boolean } };
const created = !holder.__greaseledgerLogBuffer;
const buffer = (holder.__greaseledgerLogBuffer ??= { lines: [], scheduled: false });

function flush(): void {
  buffer.scheduled = false;
  if (!buffer.lines.length) return;
  const text = `${buffer.lines.join("\n")}\n`;
  buffer.lines = [];
  process.stdout.write(text);
}

if (created) process.on("exit", flush);

/**
 * One structured record per line, in UTC. JSON encoding escapes CR, LF and control characters, so a
 * value cannot forge a second record. Never pass passwords or tokens; pass token hashes if anything.
 */
export function log(level: Level, event: string, fields: Record<string, unknown> = {}): void {
  const record = JSON.stringify({ at: new Date().toISOString(), level, event, ...fields });
  if (level === "error") {
    flush();
    console.error(record);
    return;
  }
  buffer.lines.push(record);
  if (!buffer.scheduled) {
    buffer.scheduled = true;
    setImmediate(flush);
  }
}
