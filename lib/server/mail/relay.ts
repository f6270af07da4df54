import "server-only";
import { getEnv } from "@/lib/env";
import { log } from "../log";
import { queueExpiryDigests } from "../queries/stock-expiry";
import { relayOutboxOnce } from "./outbox";
import { smtpTransport } from "./transport";

const holder = globalThis as {
  __greaseledgerRelay?: NodeJS.Timeout;
  __greaseledgerExpiryDigest?: NodeJS.Timeout;
};

/** The weekly expiry mail is checked hourly: its dedupe key makes every run after the week's first a no-op. */
const EXPIRY_DIGEST_EVERY_MS = 3_600_000;
/** The first check waits a little, so a starting server answers requests before it. */
const EXPIRY_DIGEST_FIRST_MS = 10_000;

/** Runs `task` unless its previous run is still going; failures are logged at most once a minute. */
function backgroundTask(event: string, task: () => Promise<unknown>): () => void {
  let running = false;
  let lastErrorLogged = 0;
  return () => {
    if (running) return;
    running = true;
    task()
      .catch((error: unknown) => {
        // The database may be restarting: log at most once a minute and keep polling.
        if (Date.now() - lastErrorLogged > 60_000) {
          lastErrorLogged = Date.now();
          log("warn", event, { message: error instanceof Error ? error.message : String(error) });
        }
      })
      .finally(() => {
        running = false;
      });
  };
}

/**
 * Starts the background relay of this process (once), and with it the hourly check that queues the weekly
 * near-expiry mail. Several processes may each run one.
 */
export function startOutboxRelay(): void {
  const env = getEnv();
  if (!env.OUTBOX_RELAY || holder.__greaseledgerRelay) return;
  const transport = smtpTransport();
  holder.__greaseledgerRelay = setInterval(
    backgroundTask("outbox_relay_error", () => relayOutboxOnce(transport)),
    env.OUTBOX_POLL_MS,
  );
  holder.__greaseledgerRelay.unref();
  log("info", "outbox_relay_started", { pollMs: env.OUTBOX_POLL_MS });

  const digest = backgroundTask("expiry_digest_error", () => queueExpiryDigests());
  holder.__greaseledgerExpiryDigest = setTimeout(() => {
    digest();
    holder.__greaseledgerExpiryDigest = setInterval(digest, EXPIRY_DIGEST_EVERY_MS);
    holder.__greaseledgerExpiryDigest.unref();
  }, EXPIRY_DIGEST_FIRST_MS);
  holder.__greaseledgerExpiryDigest.unref();
}
