import { can } from "./can";
import type { Action, Role } from "./types";

/**
 * What every endpoint of the app requires: each route handler (method and path) and each server action
 * (file and exported name) names the permission Action the caller's role must be allowed, or "public"
 * for the few that need no session. This is the one list the authorization tests read:
 *
 * - tests/unit/server/endpoint-policy.test.ts walks `app/**\/route.ts` and every "use server" file and fails on an
 *   endpoint missing here (deny by default), on an entry with no endpoint behind it, and on a handler whose own
 *   declaration (`apiRoute({ action })`, `runAction({ action })`, `requireActionUser(action)`) says otherwise;
 * - tests/integration/authorization.test.ts sends every endpoint a request as each role and signed out, and
 *   expects what `expectedAccess` derives from this list and PERMISSION_TABLE.
 *
 * A new endpoint gets its line here in the same change, or CI fails.
 */
export type EndpointRule = Action | "public";

/** Route handlers: "METHOD /url/path" with dynamic segments as in the folder names. */
export const ROUTE_POLICY: Readonly<Record<string, EndpointRule>> = {
  "GET /api/v1/health": "public", // liveness for probes and the benchmark; reads nothing
  "POST /api/v1/session": "public", // sign-in: the password is the check
  "DELETE /api/v1/session": "public", // sign-out: ends whatever session the cookie names, if any
  "GET /api/v1/me": "account.self",
  "GET /api/v1/audit/verify": "audit.verify",
  "POST /api/v1/calculations/consistency": "calculations.use",
  "POST /api/v1/calculations/relubrication": "calculations.use",
  "POST /api/v1/calculations/viscosity": "calculations.use",
  "POST /api/v1/compatibility/evaluate": "compatibility.evaluate",
  "GET /api/v1/compatibility/evidence": "catalogue.read",
  "POST /api/v1/compatibility/evidence": "compatibility.rules.manage",
  "GET /api/v1/compatibility/evidence/[id]/document": "catalogue.read",
  "GET /api/v1/greases": "catalogue.read",
  "POST /api/v1/greases": "catalogue.write",
  "GET /api/v1/greases/export": "catalogue.read",
  "GET /api/v1/greases/[id]": "catalogue.read",
  "PATCH /api/v1/greases/[id]": "catalogue.write",
  "POST /api/v1/greases/[id]/documents": "catalogue.write",
  "GET /api/v1/greases/[id]/documents/[kind]": "catalogue.read",
  "GET /api/v1/incidents": "incidents.read",
  "GET /api/v1/openapi.json": "public", // the API's own description (generated from the request schemas); no data
  "GET /api/v1/incidents/export": "incidents.export",
  "GET /api/v1/points": "points.read",
  "GET /api/v1/points/[tag]": "points.read",
  "GET /api/v1/points/[tag]/qr.png": "points.read",
  "GET /api/v1/points/[tag]/qr.svg": "points.read",
  "POST /api/v1/points/[tag]/services": "service.record",
  "GET /api/v1/services/export": "services.export",
  "GET /api/v1/stock": "stock.read",
  "POST /api/v1/stock/issues": "stock.issue",
  "GET /api/v1/stock/labels/[code]": "stock.read",
  "GET /api/v1/stock/labels/[code]/delivery-note": "stock.read",
  "GET /api/v1/stock/labels/[code]/qr.png": "stock.read",
  "GET /api/v1/stock/labels/[code]/qr.svg": "stock.read",
  "GET /api/v1/stock/lots": "stock.read",
  "POST /api/v1/stock/receipts": "stock.receive",
};

/** Server actions: "<file under the repository root>#<exported function>". */
export const SERVER_ACTION_POLICY: Readonly<Record<string, EndpointRule>> = {
  "app/(app)/actions.ts#signOutAction": "public", // ends the caller's own session; refused only from another site
  "app/invite/[token]/actions.ts#acceptInvitationAction": "public", // the one-time invitation token is the proof
  "app/(app)/account/actions.ts#setUnitsAction": "account.self",
  "app/(app)/admin/users/actions.ts#inviteUserAction": "users.manage",
  "app/(app)/admin/users/actions.ts#changeRoleAction": "users.manage",
  "app/(app)/admin/users/actions.ts#setSiteAccessAction": "users.manage",
  "app/(app)/admin/users/actions.ts#disableUserAction": "users.manage",
  "app/(app)/admin/users/actions.ts#enableUserAction": "users.manage",
  "app/(app)/catalogue/actions.ts#createGreaseAction": "catalogue.write",
  "app/(app)/catalogue/actions.ts#updateGreaseAction": "catalogue.write",
  "app/(app)/catalogue/import/actions.ts#previewGreaseImportAction": "catalogue.write",
  "app/(app)/catalogue/import/actions.ts#commitGreaseImportAction": "catalogue.write",
  "app/(app)/compatibility/settings/actions.ts#saveSettingsAction": "compatibility.rules.manage",
  "app/(app)/incidents/actions.ts#reportIncidentAction": "incidents.report",
  "app/(app)/incidents/actions.ts#moveIncidentAction": "incidents.work",
  "app/(app)/incidents/actions.ts#incidentNoteAction": "incidents.work",
  "app/(app)/points/[tag]/actions.ts#planChangeoverAction": "points.write",
  "app/(app)/points/[tag]/actions.ts#cancelChangeoverAction": "points.write",
  "app/(app)/points/import/actions.ts#previewPlantImportAction": "points.write",
  "app/(app)/points/import/actions.ts#commitPlantImportAction": "points.write",
  "app/(app)/points/plant-actions.ts#createAreaAction": "points.write",
  "app/(app)/points/plant-actions.ts#createAssetAction": "points.write",
  "app/(app)/points/plant-actions.ts#savePointAction": "points.write",
  "app/(app)/stock/actions.ts#receiveAction": "stock.receive",
  "app/(app)/stock/actions.ts#returnAction": "stock.move",
  "app/(app)/stock/actions.ts#transferAction": "stock.move",
  "app/(app)/stock/actions.ts#scrapAction": "stock.move",
  "app/(app)/stock/actions.ts#countAction": "stock.count",
  "app/(app)/stock/actions.ts#purchaseRequestAction": "stock.reorder.manage",
  "app/(app)/stock/actions.ts#stockPolicyAction": "stock.reorder.manage",
};

/** What a caller gets from an endpoint: refused as signed out (401), refused for the role (403), or let through. */
export type ExpectedAccess = "unauthenticated" | "forbidden" | "allowed";

/** One cell of the matrix: the rule of an endpoint and a role (`null` for a caller without a session). */
export function expectedAccess(rule: EndpointRule, role: Role | null): ExpectedAccess {
  if (rule === "public") return "allowed";
  if (role === null) return "unauthenticated";
  return can(role, rule) ? "allowed" : "forbidden";
}
