import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import type { IncidentFilter, IncidentMove, IncidentNote, IncidentReport } from "@/lib/validation/incidents";
import { appendAudit } from "../audit";
import { getSequelize } from "../db";
import { ConflictError, NotFoundError, ValidationError } from "../errors";
import { log } from "../log";
import { checkGreaseForPoint, getPointByTag } from "./points";
import { assertOwnSite, userSiteIds } from "./users";

export type IncidentKind = "refused_mix" | "changeover_exception" | "found_after_fact";
export type IncidentState = "open" | "investigating" | "closed";

export interface Incident {
  id: number;
  site: string;
  siteCode: string;
  area: string | null;
  asset: string | null;
  point: { tag: string; name: string } | null;
  kind: IncidentKind;
  state: IncidentState;
  verdict: string;
  greaseInPoint: { id: number; code: string; name: string } | null;
  greaseOffered: { id: number; code: string; name: string } | null;
  reasons: { kind: string; verdict: string; message: string; source?: string }[];
  description: string | null;
  rootCause: string | null;
  correctiveAction: string | null;
  openedBy: string | null;
  openedAt: string;
  closedBy: string | null;
  closedAt: string | null;
  version: number;
}

export interface IncidentStep {
  at: string;
  kind: "opened" | "investigating" | "note" | "closed" | "reopened";
  by: string | null;
  note: string | null;
}

const SELECT = `SELECT i.id, s.name AS site, s.code AS site_code, ar.name AS area, a.name AS asset, p.tag_code, p.name AS point_name, i.kind, i.state, i.verdict,
    gi.id AS gi_id, gi.code AS gi_code, gi.name AS gi_name, go.id AS go_id, go.code AS go_code, go.name AS go_name, i.reasons_json, i.description,
    i.root_cause, i.corrective_action, uo.name AS opened_by, i.opened_at, uc.name AS closed_by, i.closed_at, i.version
  FROM mixing_incident i JOIN site s ON s.id = i.site_id
  LEFT JOIN lube_point p ON p.id = i.point_id LEFT JOIN asset a ON a.id = p.asset_id LEFT JOIN area ar ON ar.id = a.area_id
  LEFT JOIN grease gi ON gi.id = i.grease_in_point_id LEFT JOIN grease go ON go.id = i.grease_offered_id
  LEFT JOIN app_user uo ON uo.id = i.opened_by LEFT JOIN app_user uc ON uc.id = i.closed_by`;

type Row = Record<string, unknown>;

function toIncident(r: Row): Incident {
  const grease = (id: unknown, code: unknown, name: unknown) =>
    id === null || id === undefined ? null : { id: Number(id), code: String(code), name: String(name) };
  let reasons: Incident["reasons"] = [];
  try {
    reasons = JSON.parse(String(r.reasons_json ?? "[]")) as Incident["reasons"];
  } catch {
    reasons = [];
  }
  return {
    id: Number(r.id),
    site: String(r.site),
    siteCode: String(r.site_code),
    area: (r.area as string | null) ?? null,
    asset: (r.asset as string | null) ?? null,
    point: r.tag_code ? { tag: String(r.tag_code), name: String(r.point_name) } : null,
    kind: r.kind as IncidentKind,
    state: r.state as IncidentState,
    verdict: String(r.verdict),
    greaseInPoint: grease(r.gi_id, r.gi_code, r.gi_name),
    greaseOffered: grease(r.go_id, r.go_code, r.go_name),
    reasons: Array.isArray(reasons)
      ? reasons.map((x) => ({
          kind: x.kind,
          verdict: x.verdict,
          message: x.message,
          ...(x.source ? { source: x.source } : {}),
        }))
      : [],
    description: (r.description as string | null) ?? null,
    rootCause: (r.root_cause as string | null) ?? null,
    correctiveAction: (r.corrective_action as string | null) ?? null,
    openedBy: (r.opened_by as string | null) ?? null,
    openedAt: new Date(r.opened_at as Date).toISOString(),
    closedBy: (r.closed_by as string | null) ?? null,
    closedAt: r.closed_at ? new Date(r.closed_at as Date).toISOString() : null,
    version: Number(r.version),
  };
}

/** The WHERE clause of a filtered incident list, limited to the caller's sites. */
function whereOf(filter: IncidentFilter, sites: number[]) {
  const parts = ["i.site_id IN (:sites)"];
  if (filter.from) parts.push("i.opened_at >= :from");
  if (filter.to) parts.push("i.opened_at < DATE_ADD(:to, INTERVAL 1 DAY)");
  if (filter.site) parts.push("s.code = :site");
  if (filter.area) parts.push("ar.id = :area");
  if (filter.kind) parts.push("i.kind = :kind");
  if (filter.state) parts.push("i.state = :state");
  return {
    sql: parts.join(" AND "),
    replacements: {
      sites: sites.length ? sites : [0],
      from: filter.from ?? null,
      to: filter.to ?? null,
      site: filter.site ?? null,
      area: filter.area ?? null,
      kind: filter.kind ?? null,
      state: filter.state ?? null,
    },
  };
}

/**
 * For the API: a `site` filter (a site code) must name one of the caller's sites (`assertOwnSite`); a code that names
 * no site is a 403 too.
 */
export async function assertOwnSiteCode(userId: string, siteCode: string | undefined): Promise<void> {
  if (!siteCode) return;
  const [row] = await getSequelize().query<{ id: number }>("SELECT id FROM site WHERE code = ?", { replacements: [siteCode], type: QueryTypes.SELECT });
  // A code that names no site is refused the same way as another site's.
  await assertOwnSite(userId, row ? Number(row.id) : -1, siteCode);
}

/** Incidents of the caller's sites, newest first, filtered by period (opened, days inclusive), site, area, kind and state. */
export async function listIncidents(
  userId: string,
  filter: IncidentFilter,
  limit = 500,
): Promise<Incident[]> {
  const sites = await userSiteIds(userId);
  const where = whereOf(filter, sites);
  const rows = await getSequelize().query<Row>(
    `${SELECT} WHERE ${where.sql} ORDER BY i.opened_at DESC, i.id DESC LIMIT :limit`,
    {
      replacements: { ...where.replacements, limit },
      type: QueryTypes.SELECT,
    },
  );
  return rows.map(toIncident);
}

/** Counts per kind and state for the same filter (the export's summary). */
export async function countIncidents(
  userId: string,
  filter: IncidentFilter,
): Promise<{ total: number; byKind: Record<string, number>; byState: Record<string, number> }> {
  const sites = await userSiteIds(userId);
  const where = whereOf(filter, sites);
  const rows = await getSequelize().query<{ kind: string; state: string; n: number }>(
    `SELECT i.kind, i.state, COUNT(*) AS n FROM mixing_incident i JOIN site s ON s.id = i.site_id LEFT JOIN lube_point p ON p.id = i.point_id
     LEFT JOIN asset a ON a.id = p.asset_id LEFT JOIN area ar ON ar.id = a.area_id WHERE ${where.sql} GROUP BY i.kind, i.state`,
    { replacements: where.replacements, type: QueryTypes.SELECT },
  );
  const byKind: Record<string, number> = { refused_mix: 0, changeover_exception: 0, found_after_fact: 0 };
  const byState: Record<string, number> = { open: 0, investigating: 0, closed: 0 };
  let total = 0;
  for (const r of rows) {
    byKind[r.kind] = (byKind[r.kind] ?? 0) + Number(r.n);
    byState[r.state] = (byState[r.state] ?? 0) + Number(r.n);
    total += Number(r.n);
  }
  return { total, byKind, byState };
}

/**
 * Walks the filtered incidents in id order a page at a time (keyset pagination), so an export of years of history
 * keeps memory flat; `onPage` may write each page out before the next is read.
 */
export async function forEachIncidentPage(
  userId: string,
  filter: IncidentFilter,
  onPage: (page: Incident[]) => Promise<void>,
  pageSize = 500,
): Promise<number> {
  const sites = await userSiteIds(userId);
  const where = whereOf(filter, sites);
  let after = 0;
  let total = 0;
  for (;;) {
    const rows = await getSequelize().query<Row>(
      `${SELECT} WHERE ${where.sql} AND i.id > :after ORDER BY i.id LIMIT :limit`,
      {
        replacements: { ...where.replacements, after, limit: pageSize },
        type: QueryTypes.SELECT,
      },
    );
    if (!rows.length) return total;
    const page = rows.map(toIncident);
    total += page.length;
    after = page.at(-1)!.id;
    await onPage(page);
    if (rows.length < pageSize) return total;
  }
}

/** One incident with its timeline; 404 outside the caller's sites. */
export async function getIncident(
  id: number,
  userId: string,
): Promise<{ incident: Incident; steps: IncidentStep[] }> {
  const sites = await userSiteIds(userId);
  const [row] = await getSequelize().query<Row>(`${SELECT} WHERE i.id = :id AND i.site_id IN (:sites)`, {
    replacements: { id, sites: sites.length ? sites : [0] },
    type: QueryTypes.SELECT,
  });
  if (!row) throw new NotFoundError("No such incident on your sites.");
  const steps = await getSequelize().query<{
    at: Date;
    kind: IncidentStep["kind"];
    name: string | null;
    note: string | null;
  }>(
    "SELECT e.at, e.kind, u.name, e.note FROM incident_event e LEFT JOIN app_user u ON u.id = e.actor_id WHERE e.incident_id = ? ORDER BY e.at, e.id",
    { replacements: [id], type: QueryTypes.SELECT },
  );
  return {
    incident: toIncident(row),
    steps: steps.map((s) => ({ at: new Date(s.at).toISOString(), kind: s.kind, by: s.name, note: s.note })),
  };
}

/** Writes one step of an incident's timeline in the caller's transaction. */
export async function addIncidentStep(
  incidentId: number,
  kind: IncidentStep["kind"],
  actorId: string | null,
  note: string | null,
  now: Date,
  transaction: Transaction,
): Promise<void> {
  await getSequelize().query(
    "INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, ?, ?)",
    {
      replacements: [incidentId, now, actorId, kind, note],
      transaction,
    },
  );
}

/** A lead reports a mix found after the fact ("wrong grease found in point X"), judged by the engine as it is now. */
export async function reportFoundMix(
  input: IncidentReport,
  userId: string,
  now = new Date(),
): Promise<{ id: number }> {
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    const point = await getPointByTag(input.pointTag, userId, now, transaction).catch((error: unknown) => {
      if (error instanceof NotFoundError)
        throw new ValidationError({ pointTag: ["No lube point with this tag on your sites."] });
      throw error;
    });
    const check = await checkGreaseForPoint({ ...point, changeover: null }, input.greaseFoundId, transaction);
    const [id] = await sequelize.query(
      `INSERT INTO mixing_incident (site_id, point_id, kind, grease_in_point_id, grease_offered_id, verdict, reasons_json, description, state, opened_by, opened_at)
       VALUES (?, ?, 'found_after_fact', ?, ?, ?, ?, ?, 'open', ?, ?)`,
      {
        replacements: [
          point.siteId,
          point.id,
          point.currentGrease?.id ?? null,
          input.greaseFoundId,
          check.verdict,
          JSON.stringify(check.reasons),
          input.description,
          userId,
          now,
        ],
        type: QueryTypes.INSERT,
        transaction,
      },
    );
    await addIncidentStep(Number(id), "opened", userId, input.description, now, transaction);
    log("warn", "incident_reported", { incidentId: id, pointId: point.id, by: userId });
    await appendAudit(
      {
        event: "incident.reported",
        actorId: userId,
        siteId: point.siteId,
        subjectType: "incident",
        subjectId: Number(id),
        payload: { point: point.tag, greaseFoundId: input.greaseFoundId, verdict: check.verdict },
      },
      transaction,
      now,
    );
    return { id: Number(id) };
  });
}

const NEXT: Record<IncidentMove["to"], IncidentState[]> = {
  investigating: ["open"],
  closed: ["open", "investigating"],
  open: ["closed"],
};

/**
 * Moves an incident on: open → investigating → closed (closing needs the root cause and the corrective action),
 * or reopens a closed one. The version seen by the lead must still be current, so two people cannot overwrite
 * each other's closure.
 */
export async function moveIncident(input: IncidentMove, userId: string, now = new Date()): Promise<void> {
  const sequelize = getSequelize();
  if (input.to === "closed") {
    const fields: Record<string, string[]> = {};
    if (!input.rootCause) fields.rootCause = ["Give the root cause before closing."];
    if (!input.correctiveAction) fields.correctiveAction = ["Give the corrective action before closing."];
    if (Object.keys(fields).length) throw new ValidationError(fields);
  }
  await sequelize.transaction(async (transaction) => {
    const sites = await userSiteIds(userId, transaction);
    const [row] = await sequelize.query<{ state: IncidentState; version: number; site_id: number }>(
      "SELECT state, version, site_id FROM mixing_incident WHERE id = :id AND site_id IN (:sites) FOR UPDATE",
      {
        replacements: { id: input.id, sites: sites.length ? sites : [0] },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (!row) throw new NotFoundError("No such incident on your sites.");
    if (Number(row.version) !== input.version)
      throw new ConflictError(
        "stale_version",
        "Someone else changed this incident meanwhile. Reload it and check before you save.",
      );
    if (!NEXT[input.to].includes(row.state))
      throw new ConflictError(
        "invalid_transition",
        `An incident that is ${row.state} cannot be moved to ${input.to}.`,
      );
    if (input.to === "closed") {
      await sequelize.query(
        "UPDATE mixing_incident SET state = 'closed', root_cause = ?, corrective_action = ?, closed_by = ?, closed_at = ?, version = version + 1 WHERE id = ?",
        { replacements: [input.rootCause, input.correctiveAction, userId, now, input.id], transaction },
      );
    } else {
      await sequelize.query(
        `UPDATE mixing_incident SET state = ?, ${input.to === "open" ? "closed_by = NULL, closed_at = NULL," : ""} version = version + 1 WHERE id = ?`,
        {
          replacements: [input.to, input.id],
          transaction,
        },
      );
    }
    const step = input.to === "open" ? "reopened" : input.to;
    const note =
      input.to === "closed"
        ? `Root cause: ${input.rootCause}\nCorrective action: ${input.correctiveAction}`
        : (input.note ?? null);
    await addIncidentStep(input.id, step, userId, note, now, transaction);
    log("info", "incident_moved", { incidentId: input.id, from: row.state, to: input.to, by: userId });
    await appendAudit(
      {
        event: `incident.${step}`,
        actorId: userId,
        siteId: Number(row.site_id),
        subjectType: "incident",
        subjectId: input.id,
        payload: {
          from: row.state,
          to: input.to,
          ...(input.to === "closed"
            ? { rootCause: input.rootCause, correctiveAction: input.correctiveAction }
            : { note: input.note ?? null }),
        },
      },
      transaction,
      now,
    );
  });
}

/** A note on the incident's timeline (what was found, who was told). */
export async function addIncidentNote(input: IncidentNote, userId: string, now = new Date()): Promise<void> {
  const sequelize = getSequelize();
  await sequelize.transaction(async (transaction) => {
    const sites = await userSiteIds(userId, transaction);
    const [row] = await sequelize.query<{ site_id: number }>(
      "SELECT site_id FROM mixing_incident WHERE id = :id AND site_id IN (:sites)",
      {
        replacements: { id: input.id, sites: sites.length ? sites : [0] },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (!row) throw new NotFoundError("No such incident on your sites.");
    await addIncidentStep(input.id, "note", userId, input.note, now, transaction);
    await appendAudit(
      {
        event: "incident.note",
        actorId: userId,
        siteId: Number(row.site_id),
        subjectType: "incident",
        subjectId: input.id,
        payload: { note: input.note },
      },
      transaction,
      now,
    );
  });
}

/** The names of the caller's sites, for report headings. */
export async function userSiteNames(userId: string): Promise<string[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{ name: string }>("SELECT name FROM site WHERE id IN (:sites) ORDER BY name", { replacements: { sites }, type: QueryTypes.SELECT });
  return rows.map((r) => r.name);
}
