import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/lib/domain/permissions";
import {
  ROUTE_POLICY,
  SERVER_ACTION_POLICY,
  expectedAccess,
  type ExpectedAccess,
} from "@/lib/domain/permissions/endpoints";
import { Client, rootQuery } from "./helpers";
import { callAction, manifestActions, type ActionAnswer, type ManifestAction } from "./server-actions";

/*
 * The authorization matrix (reliability S1): every route handler × method and every server action × the five roles
 * and a caller without a session, each cell's expectation derived from lib/domain/permissions/endpoints.ts and
 * PERMISSION_TABLE (never written out here). Signed out → 401, a role without the action → 403, a role with it →
 * anything but 401/403 (and never a 500). The whole matrix is sent twice: plainly, and with the
 * `x-middleware-subrequest` header that once let a request skip the framework's proxy — the checks live in the
 * handlers, so the answers must not change.
 *
 * Nothing here may change data other tests rely on: GETs that write to the audit trail (the exports) get a query
 * that fails validation after the role check; writes get a probe body that the role check lets through and the
 * schema then refuses — and a permitted write must answer 4xx, so a probe that would have been accepted fails
 * the test instead of writing. Sign-out (route and action) is tried on a session of its own.
 *
 * Server actions are called over HTTP with the ids from the build's server-reference-manifest and the
 * `Next-Action` header, i.e. through the framework exactly as a browser form posts them. Calling the exported
 * functions directly with a mocked session would test runAction, but not that each exported function really goes
 * through it in the built server, nor Next's own decoding and origin handling in front of it. The manifest is
 * also compared with the policy: an action in the build that the policy does not list fails here too.
 */

const PASSWORD = "demo-grease-2026";
const EMAIL: Record<Role, string> = {
  admin: "admin@example.com",
  lead: "lead@example.com",
  clerk: "clerk@example.com",
  technician: "tech@example.com",
  auditor: "auditor@example.com",
};
/** The requests that end the caller's session are sent from a session of their own. */
const ENDS_SESSION = new Set(["DELETE /api/v1/session", "app/(app)/actions.ts#signOutAction"]);
/** A body no write schema accepts (strict schemas refuse the unknown key, the others miss required fields). */
const PROBE = { authorizationProbe: true };
/** Reads that are also written to the audit trail: a query that fails validation after the role check. */
const QUERY: Record<string, string> = {
  "GET /api/v1/incidents/export": "?format=probe",
  "GET /api/v1/services/export": "?format=probe",
};
const SUBREQUEST = {
  "x-middleware-subrequest": "proxy:proxy:proxy:proxy:proxy:middleware:middleware:middleware:middleware:middleware",
};

type Who = Role | null;
const WHO: Who[] = [...ROLES, null];
const label = (who: Who) => who ?? "signed out";

const clients = new Map<Role, Client>();
const params: Record<string, string> = {};
let greaseId = 0;
let actions: ManifestAction[] = [];

async function signedIn(role: Role): Promise<Client> {
  const client = new Client();
  const answer = await client.signIn(EMAIL[role], PASSWORD);
  if (answer.status !== 200) throw new Error(`${role} could not sign in: ${answer.status} ${answer.text}`);
  return client;
}

/** Runs the jobs a few at a time: enough to keep the run short, little enough for a two-core machine. */
async function pool<T>(jobs: (() => Promise<T>)[], size = 4): Promise<T[]> {
  const out: T[] = new Array(jobs.length);
  let next = 0;
  await Promise.all(
    Array.from({ length: size }, async () => {
      while (next < jobs.length) {
        const index = next++;
        out[index] = await jobs[index]!();
      }
    }),
  );
  return out;
}

beforeAll(async () => {
  for (const role of ROLES) clients.set(role, await signedIn(role));
  const [point] = await rootQuery<{ tag_code: string }>(
    "SELECT p.tag_code FROM lube_point p JOIN site s ON s.id = p.site_id WHERE s.code = 'KBC' ORDER BY p.id LIMIT 1",
  );
  const [lot] = await rootQuery<{ label_code: string }>(
    "SELECT l.label_code FROM stock_lot l JOIN site s ON s.id = l.site_id WHERE s.code = 'KBC' ORDER BY l.id LIMIT 1",
  );
  const [grease] = await rootQuery<{ id: number }>("SELECT id FROM grease ORDER BY id LIMIT 1");
  if (!point || !lot || !grease) throw new Error("the demo seed has no KBC point, lot or grease");
  greaseId = Number(grease.id);
  // Every seeded user has KBC, so no cell is refused for the site rather than the role.
  Object.assign(params, { tag: point.tag_code, code: lot.label_code, id: String(greaseId), kind: "sds" });
  actions = manifestActions();
});

afterAll(async () => {
  await rootQuery("DELETE FROM sign_in_throttle");
});

// ---- route handlers --------------------------------------------------------------------------------------------

interface Cell {
  endpoint: string;
  who: Who;
  expected: ExpectedAccess;
}

const routeCells: Cell[] = Object.entries(ROUTE_POLICY).flatMap(([endpoint, rule]) =>
  WHO.map((who) => ({ endpoint, who, expected: expectedAccess(rule, who) })),
);

function routeAccess(status: number): ExpectedAccess {
  if (status === 401) return "unauthenticated";
  if (status === 403) return "forbidden";
  return "allowed";
}

async function sendRoute(cell: Cell, headers: Record<string, string>) {
  const [method, template] = cell.endpoint.split(" ") as [string, string];
  const pathname = template.replace(/\[(\w+)\]/g, (_, name: string) => {
    if (!params[name]) throw new Error(`no fixture value for [${name}] in ${cell.endpoint}`);
    return encodeURIComponent(params[name]);
  });
  let client = cell.who ? clients.get(cell.who)! : new Client();
  if (cell.who && ENDS_SESSION.has(cell.endpoint)) client = await signedIn(cell.who);
  const answer = await client.request(method, pathname + (QUERY[cell.endpoint] ?? ""), {
    headers,
    ...(method === "GET" || method === "HEAD" ? {} : { json: PROBE }),
  });
  return { ...cell, method, status: answer.status, got: routeAccess(answer.status), text: answer.text.slice(0, 300) };
}

function checkRoutes(results: Awaited<ReturnType<typeof sendRoute>>[]) {
  const wrong = results
    .filter((r) => r.got !== r.expected || r.status >= 500)
    .map((r) => `${r.endpoint} as ${label(r.who)}: expected ${r.expected}, got ${r.status} ${r.text}`);
  // A permitted write must have been refused by its schema (nothing written), except the public sign-out.
  const wrote = results
    .filter((r) => r.expected === "allowed" && r.method !== "GET" && !ENDS_SESSION.has(r.endpoint))
    .filter((r) => r.status < 400)
    .map((r) => `${r.endpoint} as ${label(r.who)} accepted the probe body (${r.status}): give it a body that fails validation`);
  expect([...wrong, ...wrote]).toEqual([]);
}

describe("route handlers: every method × every role and signed out", () => {
  it("covers every route of the policy in every cell", () => {
    expect(routeCells.length).toBe(Object.keys(ROUTE_POLICY).length * 6);
    // The matrix is not trivially uniform: each of the three answers occurs.
    const kinds = new Set(routeCells.map((c) => c.expected));
    expect([...kinds].sort()).toEqual(["allowed", "forbidden", "unauthenticated"]);
  });

  it("answers each cell as the policy says", async () => {
    checkRoutes(await pool(routeCells.map((cell) => () => sendRoute(cell, {}))));
  });

  it("answers the same with the x-middleware-subrequest header", async () => {
    checkRoutes(await pool(routeCells.map((cell) => () => sendRoute(cell, SUBREQUEST))));
  });
});

// ---- server actions --------------------------------------------------------------------------------------------

/** Arguments for the actions whose signature is not `(previousState, formData)`; each fails validation. */
const ARGS: Record<string, () => unknown[]> = {
  "app/(app)/actions.ts#signOutAction": () => [],
  "app/invite/[token]/actions.ts#acceptInvitationAction": () => [PROBE],
  "app/(app)/admin/users/actions.ts#inviteUserAction": () => [PROBE],
  "app/(app)/catalogue/actions.ts#createGreaseAction": () => [PROBE],
  "app/(app)/catalogue/actions.ts#updateGreaseAction": () => [greaseId, PROBE],
  "app/(app)/catalogue/import/actions.ts#previewGreaseImportAction": () => [0],
  "app/(app)/catalogue/import/actions.ts#commitGreaseImportAction": () => [0],
  "app/(app)/points/import/actions.ts#previewPlantImportAction": () => [0],
  "app/(app)/points/import/actions.ts#commitPlantImportAction": () => [0],
  "app/(app)/points/plant-actions.ts#savePointAction": () => [null, { status: "idle" }, new FormData()],
};
const argsOf = (key: string) => (ARGS[key] ?? (() => [{ status: "idle" }, new FormData()]))();

const SIGN_IN_FIRST = "Sign in to continue.";
const ROLE_REFUSED = "Your role may not do this.";

/** An action answers refusals as an ActionState (HTTP 200), so the cell is read from the returned message. */
function actionAccess(answer: ActionAnswer): ExpectedAccess | "broken" {
  if (answer.status >= 500 || (answer.status !== 200 && answer.status !== 303)) return "broken";
  const message = (answer.result as { message?: unknown } | undefined)?.message;
  if (message === SIGN_IN_FIRST) return "unauthenticated";
  if (message === ROLE_REFUSED) return "forbidden";
  if (answer.result === undefined && !answer.redirect) return "broken";
  return "allowed";
}

async function sendAction(key: string, who: Who, headers: Record<string, string>) {
  const action = actions.find((a) => a.key === key);
  if (!action) throw new Error(`${key} is in the policy but not in the build's manifest`);
  let client = who ? clients.get(who)! : null;
  if (who && ENDS_SESSION.has(key)) client = await signedIn(who);
  const answer = await callAction(client, action, argsOf(key), headers);
  const rule = SERVER_ACTION_POLICY[key]!;
  return { key, who, expected: expectedAccess(rule, who), got: actionAccess(answer), answer };
}

function checkActions(results: Awaited<ReturnType<typeof sendAction>>[]) {
  const wrong = results
    .filter((r) => r.got !== r.expected)
    .map((r) => `${r.key} as ${label(r.who)}: expected ${r.expected}, got ${r.got} (${r.answer.status}) ${JSON.stringify(r.answer.result) ?? r.answer.text.slice(0, 200)}`);
  // A permitted action must have stopped at its schema: no success, nothing imported.
  const wrote = results
    .filter((r) => r.expected === "allowed" && !ENDS_SESSION.has(r.key))
    .filter((r) => {
      const status = (r.answer.result as { status?: unknown } | undefined)?.status;
      return r.answer.redirect !== null || status === "success" || status === "imported";
    })
    .map((r) => `${r.key} as ${label(r.who)} accepted the probe (${JSON.stringify(r.answer.result)}): give it arguments that fail validation`);
  // Sign-out is let through for everyone and ends at the sign-in page.
  const signOut = results
    .filter((r) => ENDS_SESSION.has(r.key) && r.answer.redirect === null)
    .map((r) => `${r.key} as ${label(r.who)} did not redirect to sign-in`);
  expect([...wrong, ...wrote, ...signOut]).toEqual([]);
}

describe("server actions: every action × every role and signed out, over HTTP", () => {
  it("the build's manifest holds exactly the actions of the policy", () => {
    expect(actions.map((a) => a.key).sort()).toEqual(Object.keys(SERVER_ACTION_POLICY).sort());
  });

  it("answers each cell as the policy says", async () => {
    const jobs = Object.keys(SERVER_ACTION_POLICY).flatMap((key) => WHO.map((who) => () => sendAction(key, who, {})));
    checkActions(await pool(jobs));
  });

  it("answers the same with the x-middleware-subrequest header", async () => {
    const jobs = Object.keys(SERVER_ACTION_POLICY).flatMap((key) => WHO.map((who) => () => sendAction(key, who, SUBREQUEST)));
    checkActions(await pool(jobs));
  });

  it("sign-out without an Origin header is refused and the session lives on", async () => {
    const client = await signedIn("clerk");
    const signOut = actions.find((a) => a.key === "app/(app)/actions.ts#signOutAction")!;
    const refused = await callAction(client, signOut, [], { origin: null });
    expect(refused.redirect).toBeNull();
    expect((await client.request("GET", "/api/v1/me")).status).toBe(200);
    const done = await callAction(client, signOut, []);
    expect(done.redirect).toMatch(/\/sign-in/);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(401);
  });

  it("the sessions the matrix used are still alive (no cell signed them out)", async () => {
    for (const role of ROLES) expect((await clients.get(role)!.request("GET", "/api/v1/me")).status, role).toBe(200);
  });
});
