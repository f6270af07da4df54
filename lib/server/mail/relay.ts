import "server-only";
import { getEnv } from "@/lib/env";
import { log } from "../log";
import { relayOutboxOnce } from "./outbox";
import { smtpTransport } from "./transport";

const holder = globalThis as { __greaseledgerRelay?: NodeJS.Timeout };

/** Starts the background relay of this process (once). Several processes may each run one. */
export function startOutboxRelay(): void {
  const env = getEnv();
  if (!env.OUTBOX_RELAY || holder.__greaseledgerRelay) return;
  const transport = smtpTransport();
  let running = false;
  let lastErrorLogged = 0;
  holder.__greaseledgerRelay = setInterval(() => {
    if (running) return;
    running = true;
    relayOutboxOnce(transport)
      .catch((error: unknown) => {
        // The database may be restarting: log at most once a minute and keep polling.
        if (Date.now() - lastErrorLogged > 60_000) {
          lastErrorLogged = Date.now();
          log("warn", "outbox_relay_error", { message: error instanceof Error ? error.message : String(error) });
        }
      })
      .finally(() => {
        running = false;
      });
  }, env.OUTBOX_POLL_MS);
  holder.__greaseledgerRelay.unref();
  log("info", "outbox_relay_started", { pollMs: env.OUTBOX_POLL_MS });
}
