import { jsonResponse } from "@/lib/server/json-response";

export const dynamic = "force-dynamic";

/** Liveness only: answers without touching the database (also the framework floor in benchmarks). */
export function GET() {
  return jsonResponse({ ok: true });
}
