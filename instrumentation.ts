/** Runs once when a server process starts: the mail relay lives with the app, one per instance. */
export async function register() {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { startOutboxRelay } = await import("@/lib/server/mail/relay");
    startOutboxRelay();
  }
}
