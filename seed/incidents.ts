import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { evaluateMix } from "@/lib/domain/compatibility";
import { profileOf } from "@/lib/server/queries/compatibility";
import { getGrease } from "@/lib/server/queries/greases";

const DAY = 86_400_000;

/**
 * The demo's incident log: the refused mix the points seed opened gets its timeline, and two older incidents show
 * the rest of the workflow — one found after the fact and under investigation, one closed with its root cause and
 * corrective action.
 */
export async function seedIncidents(
  sequelize: Sequelize,
  t: Transaction,
  now: Date,
  users: { techId: string; leadId: string },
): Promise<void> {
  const q = (sql: string, replacements: unknown[]) =>
    sequelize.query(sql, { replacements, transaction: t, type: QueryTypes.INSERT });
  const open = await sequelize.query<{ id: number; opened_at: Date; opened_by: string | null }>(
    "SELECT id, opened_at, opened_by FROM mixing_incident",
    { type: QueryTypes.SELECT, transaction: t },
  );
  for (const i of open) {
    await q(
      "INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, 'opened', ?)",
      [
        i.id,
        i.opened_at,
        i.opened_by,
        "Opened by the compatibility check at the lube point; the service was refused.",
      ],
    );
  }
  const greases = new Map(
    (
      await sequelize.query<{ id: number; code: string }>("SELECT id, code FROM grease", {
        type: QueryTypes.SELECT,
        transaction: t,
      })
    ).map((g) => [g.code, Number(g.id)]),
  );
  const points = await sequelize.query<{ id: number; site_id: number; current_grease_id: number }>(
    `SELECT p.id, p.site_id, p.current_grease_id FROM lube_point p JOIN grease g ON g.id = p.current_grease_id
     WHERE g.code = 'GL-LX2' AND p.sealed_for_life = 0 ORDER BY p.id DESC LIMIT 2`,
    { type: QueryTypes.SELECT, transaction: t },
  );
  // The verdict and reasons as the engine gives them for the pair, not written by hand.
  const judge = async (inPointId: number, offeredId: number) => {
    const [a, b] = await Promise.all([getGrease(inPointId, t), getGrease(offeredId, t)]);
    const result = evaluateMix(profileOf(a!), profileOf(b!));
    return { verdict: result.verdict, reasons: JSON.stringify(result.reasons) };
  };
  const [found, closed] = points;
  if (found) {
    const at = new Date(now.getTime() - 9 * DAY);
    const offered = greases.get("GL-HT460")!;
    const judged = await judge(Number(found.current_grease_id), offered);
    const [id] = await q(
      `INSERT INTO mixing_incident (site_id, point_id, kind, grease_in_point_id, grease_offered_id, verdict, reasons_json, description, state, opened_by, opened_at, version)
       VALUES (?, ?, 'found_after_fact', ?, ?, ?, ?, ?, 'investigating', ?, ?, 1)`,
      [
        found.site_id,
        found.id,
        found.current_grease_id,
        offered,
        judged.verdict,
        judged.reasons,
        "Dark, stringy grease purged from the bearing during the quarterly inspection; the point should hold lithium complex.",
        users.leadId,
        at,
      ],
    );
    await q(
      "INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, 'opened', ?)",
      [id, at, users.leadId, "Found at inspection: dark, stringy grease at the purge port."],
    );
    await q(
      "INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, 'investigating', ?)",
      [
        id,
        new Date(at.getTime() + DAY),
        users.leadId,
        "Sample sent to the lab; asked the contractor which gun was used.",
      ],
    );
  }
  if (closed) {
    const at = new Date(now.getTime() - 41 * DAY);
    const offered = greases.get("GL-EM2")!;
    const judged = await judge(Number(closed.current_grease_id), offered);
    const [id] = await q(
      `INSERT INTO mixing_incident (site_id, point_id, kind, grease_in_point_id, grease_offered_id, verdict, reasons_json, state, root_cause, corrective_action,
         opened_by, opened_at, closed_by, closed_at, version) VALUES (?, ?, 'refused_mix', ?, ?, ?, ?, 'closed', ?, ?, ?, ?, ?, ?, 2)`,
      [
        closed.site_id,
        closed.id,
        closed.current_grease_id,
        offered,
        judged.verdict,
        judged.reasons,
        "The route sheet still named the polyurea motor grease after this point was moved to lithium complex.",
        "Route sheet reprinted from the points list; tags of the neighbouring drives checked against their assigned grease.",
        users.techId,
        at,
        users.leadId,
        new Date(at.getTime() + 3 * DAY),
      ],
    );
    await q(
      "INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, 'opened', ?)",
      [id, at, users.techId, "Opened by the compatibility check at the lube point; the service was refused."],
    );
    await q(
      "INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, 'investigating', NULL)",
      [id, new Date(at.getTime() + DAY), users.leadId],
    );
    await q(
      "INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, 'closed', ?)",
      [
        id,
        new Date(at.getTime() + 3 * DAY),
        users.leadId,
        "Root cause: The route sheet still named the polyurea motor grease after this point was moved to lithium complex.\nCorrective action: Route sheet reprinted from the points list; tags of the neighbouring drives checked against their assigned grease.",
      ],
    );
  }
}
