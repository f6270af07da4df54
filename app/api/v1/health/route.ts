export const dynamic = "force-dynamic";

/** Liveness only: answers without touching the database (also the framework floor in benchmarks). */
export function GET() {
  return Response.json({ ok: true });
}
