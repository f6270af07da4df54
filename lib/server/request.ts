import "server-only";
import { getEnv } from "@/lib/env";

type HeaderSource = { get(name: string): string | null };

/** The client's address: from X-Forwarded-For only behind a trusted proxy, else what the server saw. */
export function clientAddress(headers: HeaderSource): string {
  const forwarded = headers.get("x-forwarded-for");
  if (forwarded) {
    const parts = forwarded.split(",").map((p) => p.trim()).filter(Boolean);
    // Next's own server appends the socket address last; a trusted proxy puts the client first.
    const chosen = getEnv().TRUST_PROXY ? parts[0] : parts[parts.length - 1];
    if (chosen) return chosen.slice(0, 64);
  }
  return headers.get("x-real-ip")?.slice(0, 64) ?? "unknown";
}

/**
 * Refuses cross-site writes: a non-GET request must carry an Origin whose host is this server's host
 * (or APP_URL's), and must not be marked `Sec-Fetch-Site: cross-site`. Returns a reason, or null when fine.
 */
export function crossOriginProblem(method: string, headers: HeaderSource): string | null {
  if (method === "GET" || method === "HEAD" || method === "OPTIONS") return null;
  if (headers.get("sec-fetch-site") === "cross-site") return "cross-site request";
  const origin = headers.get("origin");
  if (!origin) return "missing Origin header";
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    return "malformed Origin header";
  }
  const allowed = new Set<string>();
  const host = headers.get("x-forwarded-host") ?? headers.get("host");
  if (host) allowed.add(host);
  try {
    allowed.add(new URL(getEnv().APP_URL).host);
  } catch {
    /* APP_URL is validated at start-up */
  }
  return allowed.has(originHost) ? null : "foreign Origin";
}
