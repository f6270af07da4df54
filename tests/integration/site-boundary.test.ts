import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Client, createUser, rootQuery, uniqueEmail } from "./helpers";
import { callAction, manifestActions, type ManifestAction } from "./server-actions";

/*
 * The site boundary (reliability S2): a lead who holds one site only asks for every object of the other site that
 * the API, the server actions and the object pages address by id, tag, label code, location or site — read and
 * write — and must get a refusal (404/403, a field error naming the object, or an empty list for a list filter),
 * never the object, and no name that belongs to the other site only may appear in any answer. The objects are read
 * from the database at run time (whatever the seed and earlier tests left), and the sweep runs in both directions.
 * The write attempts carry otherwise valid input, so the refusal has to come from the site check; the tables they
 * would touch are checksummed before and after.
 *
 * Every object is tried on its main read (the point, the container label) and on the writes that name it by id
 * (incidents, purchase requests, areas, locations); the other routes and pages that go through the same
 * lookup (QR images, delivery note, object pages, the writes on a point, a label or an asset) get a spread of four of
 * each kind, which keeps the sweep to about twenty seconds. The object pages stream, so a refused one may answer
 * 200 with the not-found page in it instead of a 404.
 */

type Site = { id: number; code: string; name: string };
type Answer = { what: string; status: number; text: string; ok: boolean; why: string };

const PASSWORD = "a-site-bound-password";
let sites: Site[] = [];
let actions: ManifestAction[] = [];
const leads = new Map<string, Client>();

const TOUCHED = [
  "service_record",
  "stock_lot",
  "stock_movement",
  "mixing_incident",
  "incident_event",
  "area",
  "asset",
  "lube_point",
  "changeover",
  "purchase_request",
  "stock_policy",
];

async function checksums(): Promise<Record<string, string>> {
  const rows = await rootQuery<{ Table: string; Checksum: string }>(`CHECKSUM TABLE ${TOUCHED.join(", ")}`);
  return Object.fromEntries(rows.map((r) => [r.Table, String(r.Checksum)]));
}

async function siteBoundLead(site: Site): Promise<Client> {
  const user = await createUser({ email: uniqueEmail(`lead-${site.code.toLowerCase()}-only`), role: "lead", password: PASSWORD });
  await rootQuery("INSERT INTO user_site_access (user_id, site_id, created_at) VALUES (?, ?, NOW())", [user.id, site.id]);
  const client = new Client();
  const answer = await client.signIn(user.email, PASSWORD);
  if (answer.status !== 200) throw new Error(`the ${site.code} lead could not sign in: ${answer.text}`);
  return client;
}

beforeAll(async () => {
  sites = (await rootQuery<Site>("SELECT id, code, name FROM site ORDER BY id")).map((s) => ({ ...s, id: Number(s.id) }));
  if (sites.length < 2) throw new Error("the sweep needs two sites");
  actions = manifestActions();
  for (const site of sites.slice(0, 2)) leads.set(site.code, await siteBoundLead(site));
});

afterAll(async () => {
  await rootQuery("DELETE FROM sign_in_throttle");
});

/** What site `to` holds, and the names that only it has (a leak if they reach a user of `from`). */
async function objectsOf(from: Site, to: Site) {
  const q = <T>(sql: string, params: unknown[] = [to.id]) => rootQuery<T>(sql, params);
  const points = await q<{ tag_code: string; name: string }>("SELECT tag_code, name FROM lube_point WHERE site_id = ? ORDER BY id");
  const labels = await q<{ label_code: string; grease_id: number; pack_id: number; location: string }>(
    `SELECT l.label_code, l.grease_id, l.pack_id, MIN(sl.code) AS location FROM stock_lot l JOIN storage_location sl ON sl.id = l.location_id
     WHERE l.site_id = ? AND l.label_code NOT IN (SELECT label_code FROM stock_lot WHERE site_id = ?)
     GROUP BY l.label_code, l.grease_id, l.pack_id ORDER BY MIN(l.id)`,
    [to.id, from.id],
  );
  const locations = await q<{ code: string }>("SELECT code FROM storage_location WHERE site_id = ? ORDER BY id");
  const lotsAt = await q<{ id: number; location: string; on_hand: number }>(
    "SELECT l.id, sl.code AS location, l.on_hand FROM stock_lot l JOIN storage_location sl ON sl.id = l.location_id WHERE l.site_id = ? ORDER BY l.id",
  );
  const incidents = await q<{ id: number; version: number }>("SELECT id, version FROM mixing_incident WHERE site_id = ? ORDER BY id");
  const requests = await q<{ id: number }>("SELECT id FROM purchase_request WHERE site_id = ? ORDER BY id");
  const areas = await q<{ id: number }>("SELECT id FROM area WHERE site_id = ? ORDER BY id");
  const assets = await q<{ id: number }>("SELECT id FROM asset WHERE site_id = ? ORDER BY id");

  const namesOf = (site: Site) =>
    rootQuery<{ name: string }>(
      `SELECT name FROM site WHERE id = :s UNION SELECT name FROM area WHERE site_id = :s UNION SELECT name FROM asset WHERE site_id = :s
       UNION SELECT name FROM lube_point WHERE site_id = :s UNION SELECT name FROM storage_location WHERE site_id = :s
       UNION SELECT lot_number FROM stock_lot WHERE site_id = :s`.replaceAll(":s", String(site.id)),
    );
  const own = new Set((await namesOf(from)).map((r) => r.name));
  const secrets = (await namesOf(to)).map((r) => r.name).filter((n) => n.length >= 6 && !own.has(n));
  return { points, labels, locations, lotsAt, incidents, requests, areas, assets, secrets };
}

/** Up to four objects spread over the list (first, last and two between). */
const spread = <T>(xs: T[]): T[] =>
  xs.length <= 4 ? xs : [...new Set([0, Math.floor(xs.length / 3), Math.floor((2 * xs.length) / 3), xs.length - 1])].map((i) => xs[i]!);

/** A lot of the user's own site with containers in it, for an issue that names the other site's point. */
async function ownLot(site: Site) {
  const [row] = await rootQuery<{ grease_id: number; pack_id: number; location: string }>(
    `SELECT l.grease_id, l.pack_id, sl.code AS location FROM stock_lot l JOIN storage_location sl ON sl.id = l.location_id
     WHERE l.site_id = ? AND l.on_hand >= 1 AND (l.expires_on IS NULL OR l.expires_on > CURDATE() + INTERVAL 60 DAY) ORDER BY l.id LIMIT 1`,
    [site.id],
  );
  if (!row) throw new Error(`site ${site.code} has no lot in stock`);
  return row;
}

/** A lube point of the user's own site with a grease in it, for a service that refers to the other site's lot. */
async function ownPoint(site: Site) {
  const [row] = await rootQuery<{ tag_code: string; grease_id: number; asset_id: number }>(
    `SELECT p.tag_code, COALESCE(p.current_grease_id, p.assigned_grease_id) AS grease_id, p.asset_id FROM lube_point p
     WHERE p.site_id = ? AND COALESCE(p.current_grease_id, p.assigned_grease_id) IS NOT NULL
       AND NOT EXISTS (SELECT 1 FROM changeover c WHERE c.point_id = p.id) ORDER BY p.id LIMIT 1`,
    [site.id],
  );
  if (!row) throw new Error(`site ${site.code} has no point with a grease`);
  return row;
}

const form = (fields: Record<string, string | number | (string | number)[]>) => {
  const data = new FormData();
  for (const [name, value] of Object.entries(fields)) {
    for (const v of Array.isArray(value) ? value : [value]) data.append(name, String(v));
  }
  return data;
};

const REFUSAL = /your sites|no access|not found|no such|unknown site/i;
/** The heading of app/not-found.tsx. */
const NOT_FOUND_PAGE = "There is nothing at this address";

async function sweep(from: Site, to: Site) {
  const client = leads.get(from.code)!;
  const o = await objectsOf(from, to);
  const own = await ownPoint(from);
  const lot = await ownLot(from);
  const answers: Answer[] = [];
  const jobs: (() => Promise<void>)[] = [];

  /** A route: refused with 403/404, or a 400 naming one of `fields`, or (`emptyList`) an empty list. */
  const route = (what: string, method: string, path: string, json?: unknown, opts: { fields?: string[]; emptyList?: boolean } = {}) =>
    jobs.push(async () => {
      const headers: Record<string, string> = method === "GET" ? {} : { "idempotency-key": randomUUID() };
      const r = await client.request(method, path, { headers, ...(json === undefined ? {} : { json }) });
      const fields = Object.keys((r.body as { error?: { fields?: object } } | null)?.error?.fields ?? {});
      const items = (r.body as { items?: unknown[] } | null)?.items;
      const ok =
        r.status === 403 ||
        r.status === 404 ||
        (r.status === 400 && (opts.fields ?? []).some((f) => fields.includes(f))) ||
        (opts.emptyList === true && r.status === 200 && Array.isArray(items) && items.length === 0);
      answers.push({ what: `${method} ${path}`, status: r.status, text: r.text, ok, why: what });
    });

  /** A list filtered to the other site: exactly 403 site_forbidden. */
  const forbidden = (what: string, path: string) =>
    jobs.push(async () => {
      const r = await client.request("GET", path);
      const ok = r.status === 403 && (r.body as { error?: { code?: string } } | null)?.error?.code === "site_forbidden";
      answers.push({ what: `GET ${path}`, status: r.status, text: r.text, ok, why: what });
    });

  /** A page: 404, or (streamed) 200 with the not-found page; the leak check covers the rest of the HTML. */
  const page = (path: string) =>
    jobs.push(async () => {
      const r = await client.request("GET", path);
      const ok = r.status === 404 || (r.status === 200 && r.text.includes(NOT_FOUND_PAGE));
      answers.push({ what: `GET ${path}`, status: r.status, text: r.text, ok, why: "object page" });
    });

  /** A server action: refused with a message about the site or the object, or a field error naming one of `fields`. */
  const action = (what: string, key: string, args: unknown[], fields: string[] = []) =>
    jobs.push(async () => {
      const target = actions.find((a) => a.key === key);
      if (!target) throw new Error(`no action ${key} in the build`);
      const r = await callAction(client, target, args);
      const result = (r.result ?? {}) as { status?: string; message?: string; fieldErrors?: Record<string, unknown>; problems?: string[]; rows?: { errors: Record<string, string> }[] };
      const ok =
        r.status === 200 &&
        r.redirect === null &&
        ((result.status === "error" && REFUSAL.test(result.message ?? "")) ||
          (result.status === "invalid" && fields.some((f) => result.fieldErrors?.[f] !== undefined)) ||
          (result.status === "preview" && fields.some((f) => result.rows?.some((row) => row.errors[f] !== undefined))));
      answers.push({ what: key.split("#")[1]!, status: r.status, text: JSON.stringify(r.result) ?? r.text.slice(0, 300), ok, why: what });
    });

  const prev = { status: "idle" };
  const [anyLabel] = o.labels;
  const greaseId = anyLabel?.grease_id ?? own.grease_id;
  const packId = anyLabel?.pack_id ?? 1;
  const qualified = (code: string) => `${to.code}/${code}`;

  for (const p of o.points) route("point", "GET", `/api/v1/points/${encodeURIComponent(p.tag_code)}`);
  for (const p of spread(o.points)) {
    const tag = encodeURIComponent(p.tag_code);
    route("point QR", "GET", `/api/v1/points/${tag}/qr.svg`);
    route("point QR", "GET", `/api/v1/points/${tag}/qr.png`);
    route("service at the point", "POST", `/api/v1/points/${tag}/services`, { greaseId: own.grease_id, grams: 1 }, { fields: ["tag"] });
    route("own stock issued against the point", "POST", "/api/v1/stock/issues", { greaseId: lot.grease_id, packId: lot.pack_id, quantity: 1, location: `${from.code}/${lot.location}`, pointTag: p.tag_code }, { fields: ["pointTag"] });
    action("incident reported at the point", "app/(app)/incidents/actions.ts#reportIncidentAction", [prev, form({ pointTag: p.tag_code, greaseFoundId: own.grease_id, description: "Found during the authorization sweep." })], ["pointTag"]);
    action("changeover planned", "app/(app)/points/[tag]/actions.ts#planChangeoverAction", [prev, form({ tag: p.tag_code, toGreaseId: own.grease_id, method: "purge", servicesPlanned: 2 })], ["tag"]);
    action("changeover cancelled", "app/(app)/points/[tag]/actions.ts#cancelChangeoverAction", [prev, form({ tag: p.tag_code })], ["tag"]);
    action("point edited", "app/(app)/points/plant-actions.ts#savePointAction", [p.tag_code, prev, pointForm(own.asset_id, own.grease_id)], ["tag"]);
    page(`/points/${tag}`);
    page(`/points/${tag}/edit`);
  }
  for (const l of o.labels) route("container label", "GET", `/api/v1/stock/labels/${encodeURIComponent(l.label_code)}`);
  for (const l of spread(o.labels)) {
    const code = encodeURIComponent(l.label_code);
    route("delivery note", "GET", `/api/v1/stock/labels/${code}/delivery-note`);
    route("label QR", "GET", `/api/v1/stock/labels/${code}/qr.svg`);
    route("label QR", "GET", `/api/v1/stock/labels/${code}/qr.png`);
    route("issue by label", "POST", "/api/v1/stock/issues", { greaseId: l.grease_id, packId: l.pack_id, quantity: 1, lotLabel: l.label_code }, { fields: ["lotLabel", "location"] });
    route("own point serviced from the label", "POST", `/api/v1/points/${encodeURIComponent(own.tag_code)}/services`, { greaseId: own.grease_id, grams: 1, containerLabel: l.label_code, takeContainer: true }, { fields: ["containerLabel"] });
    action("return", "app/(app)/stock/actions.ts#returnAction", [prev, form({ labelCode: l.label_code, location: qualified(l.location), quantity: 1 })], ["labelCode", "location"]);
    const other = o.locations.find((x) => x.code !== l.location)?.code ?? "STORE";
    action("transfer", "app/(app)/stock/actions.ts#transferAction", [prev, form({ labelCode: l.label_code, fromLocation: qualified(l.location), toLocation: qualified(other), quantity: 1 })], ["labelCode", "fromLocation", "toLocation"]);
    action("scrap", "app/(app)/stock/actions.ts#scrapAction", [prev, form({ labelCode: l.label_code, location: qualified(l.location), quantity: 1, reason: "authorization sweep" })], ["labelCode", "location"]);
    page(`/stock/lots/${code}`);
  }
  for (const loc of o.locations) {
    const location = qualified(loc.code);
    route("lots at the location", "GET", `/api/v1/stock/lots?greaseId=${greaseId}&location=${encodeURIComponent(location)}`, undefined, { fields: ["location"], emptyList: true });
    route("issue at the location", "POST", "/api/v1/stock/issues", { greaseId, packId, quantity: 1, location }, { fields: ["location"] });
    route("receipt at the location", "POST", "/api/v1/stock/receipts", { greaseId, packId, quantity: 1, lotNumber: "SWEEP-1", location }, { fields: ["location"] });
    action("receipt at the location", "app/(app)/stock/actions.ts#receiveAction", [prev, form({ greaseId, packId, quantity: 1, lotNumber: "SWEEP-1", location })], ["location"]);
    const lots = o.lotsAt.filter((l) => l.location === loc.code);
    if (lots.length)
      action("count at the location", "app/(app)/stock/actions.ts#countAction", [
        prev,
        form({ location, lotId: lots.map((l) => l.id), expected: lots.map((l) => l.on_hand), counted: lots.map((l) => Number(l.on_hand) + 1), reason: "authorization sweep" }),
      ], ["location"]);
  }
  for (const i of o.incidents) {
    action("incident moved", "app/(app)/incidents/actions.ts#moveIncidentAction", [prev, form({ id: i.id, version: i.version, to: "investigating", note: "authorization sweep" })], ["id"]);
  }
  for (const i of spread(o.incidents)) {
    action("incident note", "app/(app)/incidents/actions.ts#incidentNoteAction", [prev, form({ id: i.id, note: "Written by the authorization sweep." })], ["id"]);
    page(`/incidents/${i.id}`);
  }
  for (const r of o.requests) {
    action("purchase request", "app/(app)/stock/actions.ts#purchaseRequestAction", [prev, form({ id: r.id, state: "cancelled" })], ["id"]);
  }
  for (const a of o.areas) {
    action("asset in the area", "app/(app)/points/plant-actions.ts#createAssetAction", [prev, form({ areaId: a.id, tag: "SWEEP-1", name: "Sweep asset", kind: "motor" })], ["areaId"]);
  }
  // An area of the other site answers exactly as an area that does not exist: nothing tells which ids exist there.
  const foreignArea = o.areas[0];
  if (foreignArea)
    jobs.push(async () => {
      const target = actions.find((x) => x.key === "app/(app)/points/plant-actions.ts#createAssetAction");
      if (!target) throw new Error("no createAssetAction in the build");
      const ask = async (areaId: number) =>
        (await callAction(client, target, [prev, form({ areaId, tag: "SWEEP-2", name: "Sweep asset", kind: "motor" })])).result as
          | { status?: string; message?: string; fieldErrors?: Record<string, unknown> }
          | undefined;
      const foreign = await ask(Number(foreignArea.id));
      const unknown = await ask(2_000_000_000);
      // The form's values are echoed back (the ids differ); the rest must not.
      const verdict = (a: typeof foreign) => JSON.stringify([a?.status, a?.message, a?.fieldErrors]);
      const ok = foreign?.fieldErrors?.areaId !== undefined && verdict(foreign) === verdict(unknown);
      answers.push({ what: "createAssetAction", status: 200, text: JSON.stringify({ foreign, unknown }), ok, why: "an area of the other site answers as an unknown area" });
    });
  for (const a of spread(o.assets)) {
    action("new point on the asset", "app/(app)/points/plant-actions.ts#savePointAction", [null, prev, pointForm(a.id, own.grease_id)], ["assetId"]);
  }
  // Another site in a list's filter is a 403 (API.md), not an empty list.
  forbidden("points of the site", `/api/v1/points?site=${to.id}`);
  forbidden("incidents of the site", `/api/v1/incidents?site=${to.code}`);
  route("service export of the site", "GET", `/api/v1/services/export?format=csv&site=${to.id}`, undefined, { fields: ["site"] });
  jobs.push(async () => {
    // The incident export of another site: refused, or an empty file (the filter only narrows the caller's sites).
    const r = await client.request("GET", `/api/v1/incidents/export?format=csv&site=${to.code}`);
    const ok = r.status === 403 && (r.body as { error?: { code?: string } } | null)?.error?.code === "site_forbidden";
    answers.push({ what: `GET incidents/export?site=${to.code}`, status: r.status, text: r.text, ok, why: "incident export of the site" });
  });
  action("reorder settings of the site", "app/(app)/stock/actions.ts#stockPolicyAction", [prev, form({ siteId: to.id, greaseId, reorderPointKg: 1 })], ["siteId"]);
  action("area at the site", "app/(app)/points/plant-actions.ts#createAreaAction", [prev, form({ siteId: to.id, code: "SWEEP", name: "Sweep area" })], ["siteId"]);
  action("plant import for the site", "app/(app)/points/import/actions.ts#previewPlantImportAction", [
    `site_code,area_code,asset_tag,point_name,bearing_type,bore_mm,outside_diameter_mm,width_mm,speed_rpm\n${to.code},SWEEP,SWEEP-1,Drive end,ball,40,80,18,1500\n`,
  ], ["site_code"]);

  // A few at a time, as the matrix does.
  let next = 0;
  await Promise.all(
    Array.from({ length: 4 }, async () => {
      while (next < jobs.length) await jobs[next++]!();
    }),
  );

  const counts = { points: o.points.length, labels: o.labels.length, locations: o.locations.length, incidents: o.incidents.length, requests: o.requests.length, areas: o.areas.length, assets: o.assets.length };
  return { answers, secrets: o.secrets, counts };
}

/** A complete, valid lube point form (so that only the site can be what refuses it). */
function pointForm(assetId: number, greaseId: number) {
  return form({
    assetId,
    name: "Sweep point",
    bearingType: "ball",
    boreMm: 40,
    outsideDiameterMm: 80,
    widthMm: 18,
    speedRpm: 1500,
    runningHoursPerDay: 8,
    contamination: "low",
    moisture: "low",
    vibration: "low",
    replenishment: "side",
    assignedGreaseId: greaseId,
  });
}

describe("a user of one site gets nothing of the other site", () => {
  for (const [fromIndex, toIndex] of [
    [0, 1],
    [1, 0],
  ] as const) {
    it(`site ${fromIndex + 1}'s lead against every object of site ${toIndex + 1}`, async () => {
      const from = sites[fromIndex]!;
      const to = sites[toIndex]!;
      const before = await checksums();
      const { answers, secrets, counts } = await sweep(from, to);

      // The sweep really covered the other site's objects (the seed has all of these on both sites).
      expect(counts.points, JSON.stringify(counts)).toBeGreaterThan(0);
      expect(counts.labels).toBeGreaterThan(0);
      expect(counts.locations).toBeGreaterThan(0);
      expect(counts.areas).toBeGreaterThan(0);
      expect(secrets.length).toBeGreaterThan(0);

      const notRefused = answers.filter((a) => !a.ok).map((a) => `${a.why}: ${a.what} → ${a.status} ${a.text.slice(0, 240)}`);
      const leaks = answers.flatMap((a) => secrets.filter((s) => a.text.includes(s)).map((s) => `${a.what} shows "${s}"`));
      expect(notRefused).toEqual([]);
      expect(leaks).toEqual([]);
      expect(await checksums()).toEqual(before);
    });
  }
});
