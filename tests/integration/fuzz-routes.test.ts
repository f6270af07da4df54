import { mkdtempSync, readFileSync, readdirSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { can, isAction, type Role } from "@/lib/domain/permissions";
import { Client, ROOT, createScratchDatabase, freePort, rootConnection, startAppInstance } from "./helpers";

/*
 * Validation fuzz (reliability.md §E.2 P1, §A.3 S22): every route handler under app/, found by walking the folder at
 * test time, gets requests built by fast-check — arbitrary JSON, the route's own body with one field made wild, huge
 * and negative numbers, odd Unicode, malformed JSON, wrong content types, empty bodies, odd query strings and path
 * parameters — sent by a role that may use the route. The answer must be 2xx or 4xx, never 5xx; a 4xx must be the
 * API error body naming the problem (400: each bad field); and a 4xx must leave the database as it was.
 *
 * It runs against an app instance of its own over a scratch copy of the demo data (relay off), so its successful
 * writes cannot disturb other tests, and nothing but its own requests writes to that database. The database
 * fingerprint is `CHECKSUM TABLE` of every table (a checksum over every row's contents: any insert, update or delete
 * changes it), taken after every request and compared across each 4xx, with the number of files in UPLOAD_DIR. Left
 * out: `user_session` (a request may move its last-seen time; that is the idle timeout working). Allowed by design
 * and listed in ALLOWED_4XX_WRITES: a failed sign-in is counted and audited, and a service refused for a blocked mix
 * records the incident.
 */

const DB = "gl_fuzz_test";
process.env.DATABASE_NAME = DB;
const SEED = 20_261_202;
/** Requests per handler: a body gives more to vary than a query string. About 1,100 requests in all. */
const runsFor = (method: string) => Number(process.env.GL_FUZZ_RUNS ?? (method === "GET" ? 25 : 50));

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
interface Handler {
  file: string;
  template: string;
  method: Method;
  action: string | null; // null: public
  params: string[];
}

/** Every exported method of every app/**\/route.ts, with the action its apiRoute checks. */
function discoverHandlers(): Handler[] {
  const handlers: Handler[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts") {
        const source = readFileSync(full, "utf8");
        const segments = path
          .relative(path.join(ROOT, "app"), path.dirname(full))
          .split(path.sep)
          .filter((s) => !/^\(.*\)$/.test(s));
        const template = "/" + segments.join("/");
        const params = segments
          .filter((s) => /^\[.+\]$/.test(s))
          .map((s) => s.replace(/^\[(\.\.\.)?|\]$/g, ""));
        const exports = [
          ...source.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g),
        ];
        exports.forEach((match, i) => {
          const end = exports[i + 1]?.index ?? source.length;
          const chunk = source.slice(match.index, end);
          const action = /action:\s*"([^"]+)"/.exec(chunk)?.[1] ?? null;
          handlers.push({
            file: path.relative(ROOT, full),
            template,
            method: match[1] as Method,
            action,
            params,
          });
        });
      }
    }
  };
  walk(path.join(ROOT, "app"));
  return handlers.sort((a, b) => `${a.template} ${a.method}`.localeCompare(`${b.template} ${b.method}`));
}

const HANDLERS = discoverHandlers();
const ROLE_PREFERENCE: Role[] = ["lead", "admin", "clerk", "technician", "auditor"];
const DEMO_EMAIL: Record<Role, string> = {
  lead: "lead@example.com",
  admin: "admin@example.com",
  clerk: "clerk@example.com",
  technician: "tech@example.com",
  auditor: "auditor@example.com",
};
const roleFor = (h: Handler): Role | null =>
  h.action ? (ROLE_PREFERENCE.find((r) => can(r, h.action)) ?? null) : null;

/** Tables a 4xx may change, by design: a failed sign-in counts against the throttle and is audited; a blocked mix is an incident. */
const ALLOWED_4XX_WRITES: {
  method: Method;
  template: string;
  status: number[];
  code?: string;
  tables: string[];
}[] = [
  {
    method: "POST",
    template: "/api/v1/session",
    status: [401, 429],
    tables: ["sign_in_throttle", "audit_log", "audit_head"],
  },
  {
    method: "POST",
    template: "/api/v1/points/[tag]/services",
    status: [409],
    code: "mixing_blocked",
    tables: [
      "mixing_incident",
      "incident_event",
      "idempotency_key",
      "audit_log",
      "audit_head",
      "mail_outbox",
    ],
  },
];

// ---------------------------------------------------------------------------------------------------------------
// Values

const HUGE_AND_ODD_NUMBERS = [
  0,
  -0,
  -1,
  0.5,
  -0.5,
  1e-300,
  2 ** 31,
  2 ** 32,
  2 ** 53,
  2 ** 53 + 2,
  2 ** 64,
  -(2 ** 63),
  1e21,
  1.7976931348623157e308,
  -1.7976931348623157e308,
  Number.MIN_VALUE,
];
const ODD_STRINGS = [
  "",
  " ",
  "NaN",
  "Infinity",
  "-Infinity",
  "1e309",
  "-1",
  "0x10",
  "١٢٣", // Arabic-Indic digits
  "\u0000",
  "a\u0000b",
  "\uD800", // lone high surrogate
  "\uDFFF", // lone low surrogate
  "\u202Egnihtemos\u202C", // right-to-left override
  "שלום עולם",
  "👩‍🔧🛢️",
  "\uFEFF",
  "e\u0301",
  "%00",
  "../../etc/passwd",
  "C:\\Windows\\win.ini",
  "<script>alert(1)</script>",
  "' OR 1=1 -- ",
  '=HYPERLINK("http://x")',
  "2026-02-30",
  "0000-00-00",
  "9999-12-31",
  "-271821-04-20",
  "x".repeat(300),
  "ß".repeat(5_000),
  "🧈".repeat(20_000),
  "a".repeat(300_000), // over the JSON body limit
];

const oddString = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...ODD_STRINGS) },
  { weight: 2, arbitrary: fc.string({ unit: "binary", maxLength: 40 }) },
  { weight: 1, arbitrary: fc.string({ unit: "grapheme", maxLength: 40 }) },
);
const oddNumber = fc.oneof(
  fc.constantFrom(...HUGE_AND_ODD_NUMBERS),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.bigInt({ min: -(2n ** 70n), max: 2n ** 70n }).map(Number),
);
const wildValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: oddNumber },
  { weight: 3, arbitrary: oddString },
  { weight: 1, arbitrary: fc.constantFrom(null, true, false, [], {}, [1, 2, 3], { a: 1 }) },
  { weight: 1, arbitrary: fc.anything({ maxDepth: 2, maxKeys: 4 }) },
);
/** Numbers JSON.stringify cannot write: sent as raw JSON text (1e400 parses to Infinity). */
const RAW_NUMBERS = [
  "1e400",
  "-1e400",
  "123456789012345678901234567890",
  "-0",
  "1E-400",
  "0.0000000000000000000000001",
  "4294967296",
];

// ---------------------------------------------------------------------------------------------------------------
// Requests

interface FuzzRequest {
  method: Method;
  path: string;
  query: string;
  headers: Record<string, string>;
  body?: string;
  anonymous: boolean;
}

type Params = Record<string, string[]>;

const GARBAGE_PARAMS = [
  "0",
  "-1",
  "1.5",
  "1e3",
  "4294967296",
  "99999999999999999999999",
  "abc",
  "%00",
  "%2F",
  "%5C..%5C",
  "%E2%80%AE",
  "%F0%9F%A7%88",
  "%ED%A0%80", // the UTF-8 bytes of a lone surrogate
  "%C0%AF", // overlong "/"
  "%FF",
  "x".repeat(3000),
  "sds",
  "tds",
  "qr.png",
];

function safeEncode(value: string): string | null {
  try {
    const encoded = encodeURIComponent(value);
    return encoded === "" || encoded === "." || encoded === ".." ? null : encoded;
  } catch {
    return null; // lone surrogates cannot be percent-encoded as UTF-8
  }
}

function pathArbitrary(h: Handler, real: Params): fc.Arbitrary<string> {
  const pieces = h.params.map((name) =>
    fc.oneof(
      { weight: 3, arbitrary: fc.constantFrom(...(real[name]?.length ? real[name] : ["1"])) },
      { weight: 2, arbitrary: fc.constantFrom(...GARBAGE_PARAMS) },
      {
        weight: 1,
        arbitrary: fc
          .string({ unit: "grapheme", minLength: 1, maxLength: 30 })
          .map((s) => safeEncode(s) ?? "x"),
      },
    ),
  );
  return fc.tuple(...pieces).map((values) => {
    let i = 0;
    return h.template.replace(/\[[^\]]+\]/g, () => values[i++]!);
  });
}

/** A query a GET route answers 200 to; the fuzz also sends it with one parameter made wild or dropped. */
function validQueries(ids: {
  greaseId: number;
  packId: number;
  location: string;
}): Record<string, Record<string, string>> {
  return {
    "/api/v1/stock/lots": {
      greaseId: String(ids.greaseId),
      packId: String(ids.packId),
      location: ids.location,
    },
    "/api/v1/incidents/export": { format: "csv", from: "2026-01-01", to: "2026-12-31" },
    "/api/v1/incidents": { from: "2026-01-01", to: "2026-12-31", state: "open" },
    "/api/v1/services/export": { format: "csv", from: "2026-10-01", to: "2026-12-01" },
    "/api/v1/points": { due: "overdue" },
  };
}

function shapedQuery(base: Record<string, string>): fc.Arbitrary<string> {
  const keys = Object.keys(base);
  const encode = (o: Record<string, string>) => new URLSearchParams(o).toString();
  return fc.oneof(
    fc.constant(encode(base)),
    fc
      .tuple(fc.constantFrom(...keys), fc.oneof(oddString, oddNumber.map(String)))
      .map(([k, v]) => encode({ ...base, [k]: v.slice(0, 1000) })),
    fc
      .constantFrom(...keys)
      .map((k) => encode(Object.fromEntries(Object.entries(base).filter(([key]) => key !== k)))),
  );
}

const QUERY_KEYS = [
  "site",
  "due",
  "from",
  "to",
  "format",
  "state",
  "kind",
  "area",
  "greaseId",
  "packId",
  "location",
  "q",
  "page",
  "limit",
  "sort",
];
const queryArbitrary: fc.Arbitrary<string> = fc.oneof(
  { weight: 2, arbitrary: fc.constant("") },
  {
    weight: 4,
    arbitrary: fc
      .array(
        fc.tuple(
          fc.oneof(fc.constantFrom(...QUERY_KEYS), fc.string({ maxLength: 8 })),
          fc.oneof(
            oddString,
            oddNumber.map(String),
            fc.constantFrom("csv", "pdf", "xlsx", "ok", "due", "overdue", "open", "closed", "2026-01-01"),
          ),
        ),
        { maxLength: 4 },
      )
      .map((pairs) => {
        const search = new URLSearchParams();
        for (const [k, v] of pairs) {
          if (safeEncode(k) === null && k !== "") continue;
          if (safeEncode(v) === null && v !== "") continue;
          search.append(k, v.slice(0, 1000));
        }
        return search.toString();
      }),
  },
  {
    weight: 1,
    arbitrary: fc.constantFrom(
      "%",
      "%zz",
      "a=%ED%A0%80",
      "site=1&site=2",
      "from=&to=",
      "=",
      "&&&",
      "a[b]=c",
      "site[]=1",
    ),
  },
);

/** One valid body per JSON route, filled in with ids from the seeded data; the fuzz makes one field wild at a time. */
function validBodies(ids: {
  greaseId: number;
  otherGreaseId: number;
  packId: number;
  location: string;
  label: string;
  pointGreaseId: number;
}): Record<string, Record<string, unknown>> {
  const grease = {
    code: "FZ-1",
    name: "Fuzz grease",
    supplier: "Fuzz Oils",
    thickener: "lithium_complex",
    baseOilType: "mineral",
    viscosity40: 150,
    nlgiGrade: "2",
    foodGrade: "none",
    solidAdditives: [],
    packs: [{ kind: "cartridge", netMassGrams: 400 }],
  };
  return {
    "POST /api/v1/session": { email: "nobody@example.com", password: "not-the-password" },
    "POST /api/v1/greases": grease,
    "PATCH /api/v1/greases/[id]": { name: "Renamed by the fuzz", viscosity40: 160 },
    "POST /api/v1/compatibility/evaluate": {
      a: { greaseId: ids.greaseId },
      b: { profile: { thickener: "polyurea", baseOilType: "mineral" } },
      point: { foodGradeRequired: false },
    },
    "POST /api/v1/calculations/consistency": { workedPenetration: 280 },
    "POST /api/v1/calculations/viscosity": {
      viscosity40: 150,
      viscosity100: 15,
      temperatureC: 70,
      speedRpm: 1500,
      meanDiameterMm: 80,
    },
    "POST /api/v1/calculations/relubrication": {
      bearingType: "ball",
      boreMm: 50,
      outsideDiameterMm: 90,
      widthMm: 20,
      speedRpm: 1500,
      operatingTemperatureC: 70,
    },
    "POST /api/v1/points/[tag]/services": { greaseId: ids.pointGreaseId, grams: 5, notes: "fuzz" },
    "POST /api/v1/stock/receipts": {
      greaseId: ids.greaseId,
      packId: ids.packId,
      quantity: 2,
      lotNumber: "FZ-LOT",
      location: ids.location,
    },
    "POST /api/v1/stock/issues": {
      greaseId: ids.greaseId,
      packId: ids.packId,
      quantity: 1,
      location: ids.location,
      lotLabel: ids.label,
    },
    "POST /api/v1/compatibility/evidence": {
      greaseAId: ids.greaseId,
      greaseBId: ids.otherGreaseId,
      kind: "supplier_statement",
      verdict: "compatible",
      title: "Letter from the supplier",
    },
  };
}

/** Objects shaped like the route's body with one or more fields made wild, dropped or added. */
function shapedBody(example: Record<string, unknown>): fc.Arbitrary<string> {
  const keys = Object.keys(example);
  const replaceOne = fc
    .tuple(fc.constantFrom(...keys), wildValue)
    .map(([k, v]) => JSON.stringify({ ...example, [k]: v }));
  const replaceMany = fc
    .subarray(keys, { minLength: 1 })
    .chain((chosen) =>
      fc
        .tuple(...chosen.map(() => wildValue))
        .map((vals) =>
          JSON.stringify({ ...example, ...Object.fromEntries(chosen.map((k, i) => [k, vals[i]])) }),
        ),
    );
  const dropOne = fc
    .constantFrom(...keys)
    .map((k) => JSON.stringify(Object.fromEntries(Object.entries(example).filter(([key]) => key !== k))));
  const addOne = fc
    .tuple(fc.string({ maxLength: 12 }), wildValue)
    .map(([k, v]) => JSON.stringify({ ...example, [k]: v }));
  const rawNumber = fc
    .tuple(fc.constantFrom(...keys), fc.constantFrom(...RAW_NUMBERS))
    .map(([k, raw]) => JSON.stringify({ ...example, [k]: "__RAW__" }).replace('"__RAW__"', raw));
  const nested = fc
    .tuple(
      fc.constantFrom(...keys),
      fc.oneof(fc.anything({ maxDepth: 3 }), fc.array(wildValue, { maxLength: 3 })),
    )
    .map(([k, v]) => JSON.stringify({ ...example, [k]: v }));
  const asArray = fc.constant(JSON.stringify([example]));
  const asIs = fc.constant(JSON.stringify(example));
  return fc.oneof(asIs, replaceOne, replaceOne, replaceMany, dropOne, addOne, rawNumber, nested, asArray);
}

const MALFORMED_JSON = [
  "{",
  "}",
  "[",
  '{"a":}',
  "{'a':1}",
  '{"a":1,}',
  "NaN",
  "undefined",
  "\u0000",
  "\uFEFF{}",
  '{"a":"\\uD800"}',
  '{"__proto__":{"x":1}}',
  '{"constructor":{"prototype":{}}}',
  "null",
  "true",
  "0",
  '"string"',
  "[]",
];

function multipartBody(
  fields: [string, string][],
  file?: { name: string; type: string; bytes: string },
): { type: string; body: string } {
  const boundary = "----fuzzBoundary7MA4YWxk";
  let body = "";
  for (const [name, value] of fields)
    body += `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
  if (file)
    body += `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${file.name}"\r\nContent-Type: ${file.type}\r\n\r\n${file.bytes}\r\n`;
  return { type: `multipart/form-data; boundary=${boundary}`, body: body + `--${boundary}--\r\n` };
}

const CONTENT_TYPES = [
  "text/plain",
  "text/plain;charset=UTF-8",
  "application/x-www-form-urlencoded",
  "multipart/form-data",
  "application/xml",
  "application/json-patch+json",
  "application/jsonx",
  "application/json; charset=utf-16",
  "",
  "*/*",
];

function bodyArbitrary(
  h: Handler,
  example: Record<string, unknown> | undefined,
): fc.Arbitrary<{ headers: Record<string, string>; body?: string }> {
  const json = (text: fc.Arbitrary<string>) =>
    text.map((body) => ({ headers: { "content-type": "application/json" }, body }));
  const options: fc.Arbitrary<{ headers: Record<string, string>; body?: string }>[] = [
    json(fc.json({ maxDepth: 3 })),
    json(fc.anything({ maxDepth: 3 }).map((v) => JSON.stringify(v) ?? "")),
    json(fc.constantFrom(...MALFORMED_JSON)),
    json(fc.string({ unit: "binary", maxLength: 60 })),
    fc.constant({ headers: { "content-type": "application/json" }, body: "" }),
    fc.constant({ headers: {} }),
    fc
      .tuple(
        fc.constantFrom(...CONTENT_TYPES),
        fc.oneof(fc.constant(JSON.stringify(example ?? { a: 1 })), fc.string({ maxLength: 60 })),
      )
      .map(([type, body]) => ({
        headers: type ? { "content-type": type } : {},
        body,
      })),
    fc
      .tuple(
        fc.array(fc.tuple(fc.constantFrom("kind", "payload", "file", "x"), oddString), { maxLength: 3 }),
        fc.option(
          fc.record({
            name: fc.constantFrom(
              "x.pdf",
              "../../x.pdf",
              "/etc/passwd",
              "a\u0000b.pdf",
              "n".repeat(400) + ".pdf",
              "shell.exe",
              "",
            ),
            type: fc.constantFrom("application/pdf", "image/png", "application/octet-stream", ""),
            bytes: fc.constantFrom(
              "%PDF-1.4\n%%EOF\n",
              "\u0089PNG\r\n\u001a\n",
              "MZ\u0090\u0000",
              "",
              "plain text",
            ),
          }),
          { nil: undefined },
        ),
      )
      .map(([fields, file]) => {
        const { type, body } = multipartBody(
          fields.map(([k, v]) => [k, v.slice(0, 5000)]),
          file,
        );
        return { headers: { "content-type": type }, body };
      }),
  ];
  if (example) options.push(json(shapedBody(example)), json(shapedBody(example)), json(shapedBody(example)));
  // the upload routes: the right form with a wild payload or kind
  if (/documents$|evidence$/.test(h.template))
    options.push(
      fc
        .tuple(example ? shapedBody(example) : fc.json(), fc.oneof(fc.constantFrom("sds", "tds"), oddString))
        .map(([payload, kind]) => {
          const { type, body } = multipartBody(
            [
              ["payload", payload],
              ["kind", kind.slice(0, 1000)],
            ],
            {
              name: "sheet.pdf",
              type: "application/pdf",
              bytes: "%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n",
            },
          );
          return { headers: { "content-type": type }, body };
        }),
    );
  return fc.oneof(...options);
}

const idempotencyHeader = fc.oneof(
  { weight: 4, arbitrary: fc.constant(undefined) },
  { weight: 1, arbitrary: fc.constantFrom("", " ", "k".repeat(256), "ключ", "a b", "\t", "fuzz-key-1") },
  { weight: 1, arbitrary: fc.uuid() },
);

function requestArbitrary(
  h: Handler,
  real: Params,
  examples: Record<string, Record<string, unknown>>,
  queries: Record<string, Record<string, string>>,
): fc.Arbitrary<FuzzRequest> {
  const example = examples[`${h.method} ${h.template}`];
  const validQuery = h.method === "GET" ? queries[h.template] : undefined;
  const hasBody = h.method !== "GET";
  return fc
    .record({
      path: pathArbitrary(h, real),
      query: validQuery
        ? fc.oneof(
            { weight: 3, arbitrary: shapedQuery(validQuery) },
            { weight: 1, arbitrary: queryArbitrary },
          )
        : queryArbitrary,
      payload: hasBody
        ? bodyArbitrary(h, example)
        : fc.constantFrom<{ headers: Record<string, string>; body?: string }>(
            { headers: {} },
            { headers: { "content-type": "text/plain" } },
          ),
      key: idempotencyHeader,
    })
    .map(({ path: p, query, payload, key }) => {
      const headers = { ...payload.headers };
      if (key !== undefined && /^[\x20-\x7e\u0080-\u00ff]*$/.test(key)) headers["idempotency-key"] = key;
      const request: FuzzRequest = {
        method: h.method,
        path: p,
        query,
        headers,
        body: payload.body,
        anonymous: h.action === null,
      };
      // A shrunk counterexample is printed with long strings cut, so a failure stays readable.
      return Object.assign(request, {
        [fc.toStringMethod]: () =>
          JSON.stringify(request, (_k, v: unknown) =>
            typeof v === "string" && v.length > 160 ? `${v.slice(0, 160)}…(${v.length} chars)` : v,
          ),
      });
    });
}

// ---------------------------------------------------------------------------------------------------------------
// The app instance, its database and the fingerprint

let app: Awaited<ReturnType<typeof startAppInstance>>;
let uploadDir = "";
let root: Awaited<ReturnType<typeof rootConnection>>;
let tables: string[] = [];
const clients = new Map<Role, Client>();
const real: Record<string, Params> = {};
let examples: Record<string, Record<string, unknown>> = {};
let queries: Record<string, Record<string, string>> = {};

async function fingerprint(): Promise<Map<string, string>> {
  const rows = (await root.query(`CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(", ")}`)) as {
    Table: string;
    Checksum: unknown;
  }[];
  return new Map(rows.map((r) => [r.Table.split(".").pop()!, String(r.Checksum)]));
}

function changedTables(before: Map<string, string>, after: Map<string, string>): string[] {
  return tables.filter((t) => before.get(t) !== after.get(t));
}

beforeAll(async () => {
  await createScratchDatabase(DB);
  const { getSequelize } = await import("@/lib/server/db");
  const { seedDemo } = await import("@/seed/demo");
  await seedDemo(getSequelize());
  await getSequelize().close();
  uploadDir = mkdtempSync(path.join(os.tmpdir(), "gl-fuzz-uploads-"));
  app = await startAppInstance(await freePort(), { DATABASE_NAME: DB, UPLOAD_DIR: uploadDir });
  root = await rootConnection(DB);
  tables = (
    (await root.query(
      "SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE' ORDER BY table_name",
      [DB],
    )) as { t: string }[]
  )
    .map((r) => r.t)
    .filter((t) => t !== "user_session");

  for (const role of new Set(HANDLERS.map(roleFor).filter((r): r is Role => r !== null))) {
    const client = new Client(app.url);
    expect((await client.signIn(DEMO_EMAIL[role])).status).toBe(200);
    clients.set(role, client);
  }

  const pick = async (sql: string) => ((await root.query(sql)) as { v: unknown }[]).map((r) => String(r.v));
  const greaseIds = await pick("SELECT id AS v FROM grease ORDER BY id LIMIT 3");
  // A lot in stock (its location as SITE/CODE: the lead has two sites) and a point with the grease it takes.
  const [lot] = (await root.query(
    `SELECT l.grease_id, l.pack_id, l.label_code, CONCAT(si.code, '/', s.code) AS code FROM stock_lot l
     JOIN storage_location s ON s.id = l.location_id JOIN site si ON si.id = s.site_id WHERE l.on_hand > 0 ORDER BY l.id LIMIT 1`,
  )) as { grease_id: number; pack_id: number; label_code: string; code: string }[];
  const [point] = (await root.query(
    "SELECT tag_code, assigned_grease_id FROM lube_point WHERE assigned_grease_id IS NOT NULL ORDER BY id LIMIT 1",
  )) as {
    tag_code: string;
    assigned_grease_id: number;
  }[];
  const tags = [
    point!.tag_code,
    ...(await pick("SELECT tag_code AS v FROM lube_point ORDER BY id DESC LIMIT 2")),
  ];
  const labels = await pick("SELECT label_code AS v FROM stock_lot ORDER BY id LIMIT 3");
  const evidence = await pick("SELECT id AS v FROM grease_pair_evidence ORDER BY id LIMIT 2");
  for (const h of HANDLERS) {
    const params: Params = {};
    for (const name of h.params) {
      if (name === "tag") params[name] = tags;
      else if (name === "code") params[name] = labels;
      else if (name === "kind") params[name] = ["sds", "tds"];
      else if (name === "id") params[name] = h.template.includes("/evidence/") ? evidence : greaseIds;
    }
    real[h.template] = params;
  }
  examples = validBodies({
    greaseId: Number(lot!.grease_id),
    otherGreaseId: Number(greaseIds.find((g) => Number(g) !== Number(lot!.grease_id)) ?? 1),
    packId: Number(lot!.pack_id),
    location: lot!.code,
    label: lot!.label_code,
    pointGreaseId: Number(point!.assigned_grease_id),
  });
  queries = validQueries({
    greaseId: Number(lot!.grease_id),
    packId: Number(lot!.pack_id),
    location: lot!.code,
  });
}, 300_000);

afterAll(async () => {
  await root?.end();
  await app?.stop();
  const conn = await rootConnection(null);
  try {
    await conn.query(`DROP DATABASE IF EXISTS ${DB}`);
  } finally {
    await conn.end();
  }
  if (uploadDir) rmSync(uploadDir, { recursive: true, force: true });
});

// ---------------------------------------------------------------------------------------------------------------
// The properties

async function send(client: Client | null, r: FuzzRequest) {
  const headers: Record<string, string> = { origin: new URL(app.url).origin, ...r.headers };
  if (client) headers.cookie = [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  const response = await fetch(`${app.url}${r.path}${r.query ? `?${r.query}` : ""}`, {
    method: r.method,
    headers,
    body: r.body,
    redirect: "manual",
  });
  const text = await response.text();
  return {
    status: response.status,
    type: response.headers.get("content-type") ?? "",
    retryAfter: response.headers.get("retry-after"),
    text,
  };
}

/** What is wrong with a 4xx answer, or null: the API error body, 400 naming each field. */
function errorShapeProblem(
  status: number,
  type: string,
  text: string,
  retryAfter: string | null,
): string | null {
  if (!/application\/json/.test(type))
    return `a ${status} that is not JSON (${type || "no content type"}): ${text.slice(0, 200)}`;
  let body: { error?: { code?: unknown; message?: unknown; fields?: unknown } };
  try {
    body = JSON.parse(text) as typeof body;
  } catch {
    return `a ${status} whose body is not JSON: ${text.slice(0, 200)}`;
  }
  const error = body.error;
  if (!error || typeof error.code !== "string" || !/^[a-z][a-z0-9_]*$/.test(error.code))
    return `no snake_case error.code in ${text.slice(0, 300)}`;
  if (typeof error.message !== "string" || error.message.trim().length < 5)
    return `no error.message in ${text.slice(0, 300)}`;
  if (status === 400) {
    const fields = error.fields as Record<string, unknown> | undefined;
    if (!fields || typeof fields !== "object" || !Object.keys(fields).length)
      return `a 400 that names no field: ${text.slice(0, 300)}`;
    for (const [name, messages] of Object.entries(fields)) {
      if (
        !name ||
        !Array.isArray(messages) ||
        !messages.length ||
        !messages.every((m) => typeof m === "string" && m.trim().length > 0)
      )
        return `field ${JSON.stringify(name)} without a message: ${text.slice(0, 300)}`;
    }
  }
  if (status === 429 && !retryAfter) return "a 429 without Retry-After";
  return null;
}

describe("validation fuzz over every route handler (P1, S22)", () => {
  it("finds the route handlers under app/ and a role for each", () => {
    const names = HANDLERS.map((h) => `${h.method} ${h.template}`);
    expect(names).toContain("POST /api/v1/stock/issues");
    expect(names).toContain("PATCH /api/v1/greases/[id]");
    expect(names).toContain("GET /api/v1/health");
    for (const h of HANDLERS) {
      if (h.action !== null) {
        expect(isAction(h.action), `${h.file}: unknown action ${h.action}`).toBe(true);
        expect(roleFor(h), `${h.file}: no demo role may ${h.action}`).not.toBeNull();
      }
    }
  });

  it.each(HANDLERS.map((h) => [`${h.method} ${h.template}`, h] as const))(
    "%s: never 5xx; a 4xx names the problem and writes nothing",
    async (_name, h) => {
      const role = roleFor(h);
      const client = role ? clients.get(role)! : null;
      let current = await fingerprint();
      let storedFiles = readdirSync(uploadDir).length;
      const seen = new Map<number, number>();
      await fc.assert(
        fc.asyncProperty(requestArbitrary(h, real[h.template] ?? {}, examples, queries), async (r) => {
          const answer = await send(r.anonymous ? null : client, r);
          seen.set(answer.status, (seen.get(answer.status) ?? 0) + 1);
          const after = await fingerprint();
          const before = current;
          current = after;
          if (answer.status < 400) storedFiles = readdirSync(uploadDir).length;
          if (answer.status >= 500)
            throw new Error(`answered ${answer.status}: ${answer.text.slice(0, 500)}`);
          if (answer.status < 200 || (answer.status >= 300 && answer.status < 400))
            throw new Error(`answered ${answer.status}`);
          if (answer.status >= 400) {
            // Plain answers of the framework and the HTTP server (404/405: the path left this route; 431: the URL or
            // headers are over Node's size limit) come before the app; every answer of ours is the API error body.
            const framework = [404, 405, 431].includes(answer.status) && !/json/.test(answer.type);
            if (!framework) {
              const problem = errorShapeProblem(answer.status, answer.type, answer.text, answer.retryAfter);
              if (problem) throw new Error(problem);
            }
            let changed = changedTables(before, after);
            const code = /"code":"([a-z_]+)"/.exec(answer.text)?.[1];
            const allowed = ALLOWED_4XX_WRITES.find(
              (a) =>
                a.method === h.method &&
                a.template === h.template &&
                a.status.includes(answer.status) &&
                (!a.code || a.code === code),
            );
            if (allowed) changed = changed.filter((t) => !allowed.tables.includes(t));
            if (changed.length) throw new Error(`a ${answer.status} (${code}) changed ${changed.join(", ")}`);
            const files = readdirSync(uploadDir).length;
            if (files !== storedFiles)
              throw new Error(
                `a ${answer.status} (${code}) left ${files - storedFiles} file(s) in UPLOAD_DIR`,
              );
          }
        }),
        { seed: SEED, numRuns: runsFor(h.method) },
      );
      if (process.env.GL_FUZZ_REPORT)
        console.log(
          `${h.method} ${h.template}: ${JSON.stringify(Object.fromEntries([...seen].sort(([a], [b]) => a - b)))}`,
        );
      // The run must have reached the handler: at least one answer that is not a 401/403 from the guard.
      expect(
        [...seen.keys()].some((s) => s !== 401 && s !== 403),
        `only ${[...seen.keys()].join(", ")}`,
      ).toBe(true);
    },
  );
});

describe("findings of the fuzz, kept as plain cases", () => {
  it.each(["/api/v1/greases/%FF", "/api/v1/points/%ED%A0%80/qr.svg", "/api/v1/stock/labels/%C0%AF"])(
    "%s (percent-encoding that does not decode) → 400 naming the path, not 500",
    async (pathname) => {
      const response = await new Client(app.url).request("GET", pathname);
      expect(response.status).toBe(400);
      expect(response.body.error).toMatchObject({
        code: "malformed_path",
        fields: { path: [expect.any(String)] },
      });
    },
  );

  // The API skips the proxy except where its address holds a percent-escape; a write with a body is refused too.
  it.each([
    ["PATCH", "/api/v1/greases/%FF"],
    ["POST", "/api/v1/points/%C0%AF/services"],
  ])("%s %s with a JSON body → 400 naming the path, not 500", async (method, pathname) => {
    const response = await clients.get("lead")!.request(method, pathname, {
      body: "{}",
      headers: { "content-type": "application/json" },
    });
    expect(response.status).toBe(400);
    expect(response.body.error).toMatchObject({ code: "malformed_path", fields: { path: [expect.any(String)] } });
    expect(response.headers.get("content-security-policy")).toContain("default-src 'none'");
  });

  it("a page address that does not decode → 400 with the security headers", async () => {
    const response = await fetch(`${app.url}/points/%FF`, { redirect: "manual" });
    expect(response.status).toBe(400);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
  });

  it("POST /api/v1/greases with the JSON body null → 400, not 500", async () => {
    const response = await clients
      .get("lead")!
      .request("POST", "/api/v1/greases", { body: "null", headers: { "content-type": "application/json" } });
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields)).toEqual(["body"]);
  });
});
