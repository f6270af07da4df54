import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";
import { ROLES, isAction } from "@/lib/domain/permissions";
import {
  ROUTE_POLICY,
  SERVER_ACTION_POLICY,
  expectedAccess,
  type EndpointRule,
} from "@/lib/domain/permissions/endpoints";

/*
 * Deny by default (reliability S4): every route handler and every server action of the app must have a line in
 * lib/domain/permissions/endpoints.ts, every line there must have an endpoint behind it, and what the handler itself
 * declares to its wrapper must be what the line says. The sources are read with the TypeScript parser, so an export
 * written in another shape than the ones understood here fails loudly instead of being skipped.
 *
 * What counts as a declaration:
 * - route handler: `export const GET = apiRoute({ action: "x" } | { public: true }, …)`; an exported handler that is
 *   not built with apiRoute has no guard at all and may only be listed as "public";
 * - server action: the `action` of every `runAction({ action: "x", … })` and every `requireActionUser("x")` in the
 *   exported function; none at all means the action has no role check and may only be listed as "public".
 */

const ROOT = path.resolve(import.meta.dirname, "..", "..", "..");
const SOURCE_DIRS = ["app", "components", "lib"];
const HTTP_METHODS = new Set(["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"]);

type Declared = EndpointRule | { problem: string };

function walk(dir: string, out: string[] = []): string[] {
  for (const entry of readdirSync(path.join(ROOT, dir), { withFileTypes: true })) {
    const rel = path.posix.join(dir, entry.name);
    if (entry.isDirectory()) walk(rel, out);
    else if (/\.(ts|tsx)$/.test(entry.name) && !entry.name.endsWith(".d.ts")) out.push(rel);
  }
  return out;
}

function parse(rel: string): ts.SourceFile {
  const text = readFileSync(path.join(ROOT, rel), "utf8");
  return ts.createSourceFile(rel, text, ts.ScriptTarget.Latest, true, rel.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
}

const hasExport = (node: ts.Node) =>
  ts.canHaveModifiers(node) && (ts.getModifiers(node) ?? []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);

const isDirective = (statement: ts.Statement, text: string) =>
  ts.isExpressionStatement(statement) && ts.isStringLiteral(statement.expression) && statement.expression.text === text;

/** "use server" as the file's directive (before any other statement). */
function isServerActionFile(file: ts.SourceFile): boolean {
  for (const statement of file.statements) {
    if (isDirective(statement, "use server")) return true;
    if (!(ts.isExpressionStatement(statement) && ts.isStringLiteral(statement.expression))) return false;
  }
  return false;
}

/** "use server" inside a function body: an inline action, which would escape the list. */
function inlineServerActions(file: ts.SourceFile): number {
  let found = 0;
  const visit = (node: ts.Node) => {
    if (ts.isBlock(node) && node.parent && ts.isFunctionLike(node.parent)) {
      if (node.statements.some((s) => isDirective(s, "use server"))) found += 1;
    }
    ts.forEachChild(node, visit);
  };
  visit(file);
  return found;
}

const calleeName = (call: ts.CallExpression) => (ts.isIdentifier(call.expression) ? call.expression.text : null);

function objectProperty(object: ts.ObjectLiteralExpression, name: string): ts.Expression | undefined {
  for (const property of object.properties) {
    if (ts.isPropertyAssignment(property) && ts.isIdentifier(property.name) && property.name.text === name) return property.initializer;
  }
  return undefined;
}

/** What an `apiRoute(options, handler)` call declares. */
function declaredByApiRoute(call: ts.CallExpression): Declared {
  const options = call.arguments[0];
  if (!options || !ts.isObjectLiteralExpression(options)) return { problem: "apiRoute's options are not an object literal" };
  const action = objectProperty(options, "action");
  const isPublic = objectProperty(options, "public");
  if (action && isPublic) return { problem: "apiRoute declares both an action and public" };
  if (action) {
    if (!ts.isStringLiteral(action) || !isAction(action.text)) return { problem: "apiRoute's action is not a known action literal" };
    return action.text;
  }
  if (isPublic && isPublic.kind === ts.SyntaxKind.TrueKeyword) return "public";
  return { problem: "apiRoute declares neither an action nor public: true (it refuses everyone)" };
}

/** Route handlers: exported HTTP methods of one route.ts file. */
function routeDeclarations(file: ts.SourceFile): Map<string, Declared> {
  const found = new Map<string, Declared>();
  for (const statement of file.statements) {
    if (!hasExport(statement)) continue;
    if (ts.isVariableStatement(statement)) {
      for (const decl of statement.declarationList.declarations) {
        if (!ts.isIdentifier(decl.name) || !HTTP_METHODS.has(decl.name.text)) continue;
        const init = decl.initializer;
        const wrapped = init && ts.isCallExpression(init) && calleeName(init) === "apiRoute";
        found.set(decl.name.text, wrapped ? declaredByApiRoute(init) : "public");
      }
    } else if (ts.isFunctionDeclaration(statement) && statement.name && HTTP_METHODS.has(statement.name.text)) {
      found.set(statement.name.text, "public");
    } else if (ts.isExportDeclaration(statement)) {
      found.set(`(re-export at line ${file.getLineAndCharacterOfPosition(statement.getStart()).line + 1})`, {
        problem: "route handlers must be declared in place, not re-exported",
      });
    }
  }
  return found;
}

/** What one server action function declares: the actions of its runAction / requireActionUser calls. */
function declaredByActionBody(body: ts.Node): Declared {
  const actions = new Set<string>();
  const problems: string[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isCallExpression(node)) {
      const name = calleeName(node);
      if (name === "runAction") {
        const options = node.arguments[0];
        const action = options && ts.isObjectLiteralExpression(options) ? objectProperty(options, "action") : undefined;
        if (action && ts.isStringLiteral(action)) actions.add(action.text);
        else problems.push("runAction's action is not a string literal");
      } else if (name === "requireActionUser") {
        const action = node.arguments[0];
        if (action && ts.isStringLiteral(action)) actions.add(action.text);
        else problems.push("requireActionUser's action is not a string literal");
      }
    }
    ts.forEachChild(node, visit);
  };
  visit(body);
  if (problems.length) return { problem: problems.join("; ") };
  if (actions.size > 1) return { problem: `checks several actions (${[...actions].join(", ")})` };
  const [only] = [...actions];
  if (only === undefined) return "public";
  return isAction(only) ? only : { problem: `unknown action ${only}` };
}

/** Server actions: every exported value of a "use server" file (types and interfaces are not endpoints). */
function actionDeclarations(file: ts.SourceFile): Map<string, Declared> {
  const found = new Map<string, Declared>();
  for (const statement of file.statements) {
    if (ts.isExportAssignment(statement)) {
      found.set("default", { problem: "a default export cannot be listed; export a named async function" });
      continue;
    }
    if (ts.isExportDeclaration(statement)) {
      if (!statement.isTypeOnly) found.set("(re-export)", { problem: "server actions must be declared in place, not re-exported" });
      continue;
    }
    if (!hasExport(statement)) continue;
    if (ts.isInterfaceDeclaration(statement) || ts.isTypeAliasDeclaration(statement)) continue;
    if (ts.isFunctionDeclaration(statement) && statement.name && statement.body) {
      found.set(statement.name.text, declaredByActionBody(statement.body));
    } else if (ts.isVariableStatement(statement)) {
      for (const decl of statement.declarationList.declarations) {
        const name = ts.isIdentifier(decl.name) ? decl.name.text : decl.name.getText();
        const init = decl.initializer;
        found.set(
          name,
          init && (ts.isArrowFunction(init) || ts.isFunctionExpression(init))
            ? declaredByActionBody(init.body)
            : { problem: "an exported value of a server action file that is not a function" },
        );
      }
    } else {
      found.set(`(export at line ${file.getLineAndCharacterOfPosition(statement.getStart()).line + 1})`, {
        problem: "an export of a shape this test does not understand",
      });
    }
  }
  return found;
}

/** "app/api/v1/points/[tag]/route.ts" → "/api/v1/points/[tag]" (route groups dropped). */
function urlPathOf(routeFile: string): string {
  const segments = path.posix.dirname(routeFile).split("/").slice(1);
  return "/" + segments.filter((s) => !/^\(.*\)$/.test(s)).join("/");
}

function collect() {
  const files = SOURCE_DIRS.flatMap((dir) => walk(dir));
  const routes = new Map<string, Declared>();
  const actions = new Map<string, Declared>();
  const inline: string[] = [];
  for (const rel of files) {
    const file = parse(rel);
    if (rel.startsWith("app/") && /\/route\.(ts|tsx)$/.test(rel)) {
      for (const [method, declared] of routeDeclarations(file)) routes.set(`${method} ${urlPathOf(rel)}`, declared);
    }
    if (isServerActionFile(file)) {
      for (const [name, declared] of actionDeclarations(file)) actions.set(`${rel}#${name}`, declared);
    }
    if (inlineServerActions(file)) inline.push(rel);
  }
  return { routes, actions, inline };
}

const found = collect();

function compare(kind: string, declared: Map<string, Declared>, policy: Readonly<Record<string, EndpointRule>>) {
  const missing = [...declared.keys()].filter((key) => !Object.hasOwn(policy, key));
  const stale = Object.keys(policy).filter((key) => !declared.has(key));
  const mismatched = [...declared]
    .filter(([key]) => Object.hasOwn(policy, key))
    .flatMap(([key, value]) =>
      typeof value === "object"
        ? [`${key}: ${value.problem}`]
        : value !== policy[key]
          ? [`${key}: the code declares ${value}, the ${kind} policy says ${policy[key]}`]
          : [],
    );
  return { missing, stale, mismatched };
}

describe("every endpoint has a policy entry (deny by default)", () => {
  it("finds the endpoints at all (the walk is not silently empty)", () => {
    expect(found.routes.size).toBeGreaterThanOrEqual(30);
    expect(found.actions.size).toBeGreaterThanOrEqual(25);
  });

  it("route handlers: none missing from ROUTE_POLICY, none stale, each declares what the policy says", () => {
    expect(compare("route", found.routes, ROUTE_POLICY)).toEqual({ missing: [], stale: [], mismatched: [] });
  });

  it("server actions: none missing from SERVER_ACTION_POLICY, none stale, each checks what the policy says", () => {
    expect(compare("server action", found.actions, SERVER_ACTION_POLICY)).toEqual({ missing: [], stale: [], mismatched: [] });
  });

  it("has no inline server actions (a 'use server' inside a function would escape the list)", () => {
    expect(found.inline).toEqual([]);
  });

  it("every rule is public or a known action", () => {
    const rules = [...Object.values(ROUTE_POLICY), ...Object.values(SERVER_ACTION_POLICY)];
    expect(rules.filter((rule) => rule !== "public" && !isAction(rule))).toEqual([]);
  });
});

describe("the checker itself", () => {
  const fromSource = (text: string, kind: "route" | "action") => {
    const file = ts.createSourceFile("x.ts", text, ts.ScriptTarget.Latest, true);
    return kind === "route" ? routeDeclarations(file) : actionDeclarations(file);
  };

  it("reads route handlers: wrapped with an action, public, unwrapped, and a wrapper without either", () => {
    const routes = fromSource(
      `export const GET = apiRoute<{ id: string }>({ action: "stock.read" }, async () => x);
       export const POST = apiRoute({ public: true, body: s }, async () => x);
       export function DELETE() { return x; }
       export const PATCH = apiRoute({ body: s }, async () => x);
       export const dynamic = "force-dynamic";`,
      "route",
    );
    expect(Object.fromEntries(routes)).toEqual({
      GET: "stock.read",
      POST: "public",
      DELETE: "public",
      PATCH: { problem: "apiRoute declares neither an action nor public: true (it refuses everyone)" },
    });
  });

  it("reads server actions: runAction, requireActionUser, none, two different, and non-functions", () => {
    const actions = fromSource(
      `"use server";
       export interface State { a: number }
       export async function a(_p: unknown, f: FormData) { return runAction({ action: "stock.move", schema: s, success: "" }, f, w); }
       export async function b(t: unknown) { const u = await requireActionUser("points.write"); return u; }
       export async function c() { return 1; }
       export async function d() { await requireActionUser("points.write"); return runAction({ action: "users.manage" }, 1, w); }
       export const e = async () => requireActionUser("catalogue.write");
       export const f = 3;`,
      "action",
    );
    expect(Object.fromEntries(actions)).toEqual({
      a: "stock.move",
      b: "points.write",
      c: "public",
      d: { problem: "checks several actions (points.write, users.manage)" },
      e: "catalogue.write",
      f: { problem: "an exported value of a server action file that is not a function" },
    });
  });

  it("reports missing, stale and mismatched entries", () => {
    const declared = new Map<string, Declared>([
      ["GET /a", "stock.read"],
      ["GET /b", "public"],
      ["POST /c", "stock.issue"],
    ]);
    expect(compare("route", declared, { "GET /a": "stock.read", "POST /c": "stock.receive", "GET /gone": "public" })).toEqual({
      missing: ["GET /b"],
      stale: ["GET /gone"],
      mismatched: ["POST /c: the code declares stock.issue, the route policy says stock.receive"],
    });
  });

  it("finds inline server actions and tells a directive from a later string", () => {
    const inline = ts.createSourceFile("x.tsx", `export default function P() { async function go() { "use server"; } return null; }`, ts.ScriptTarget.Latest, true);
    expect(inlineServerActions(inline)).toBe(1);
    expect(isServerActionFile(ts.createSourceFile("y.ts", `"use strict"; "use server"; export async function a() {}`, ts.ScriptTarget.Latest, true))).toBe(true);
    expect(isServerActionFile(ts.createSourceFile("z.ts", `import x from "y"; "use server";`, ts.ScriptTarget.Latest, true))).toBe(false);
  });

  it("maps route files to URL paths without route groups", () => {
    expect(urlPathOf("app/api/v1/points/[tag]/qr.png/route.ts")).toBe("/api/v1/points/[tag]/qr.png");
    expect(urlPathOf("app/(app)/x/route.ts")).toBe("/x");
  });

  it("derives each cell from the rule: public for everyone, 401 signed out, 403 without the action", () => {
    expect(ROLES.map((role) => expectedAccess("users.manage", role))).toEqual(["allowed", "forbidden", "forbidden", "forbidden", "forbidden"]);
    expect(expectedAccess("users.manage", null)).toBe("unauthenticated");
    expect(expectedAccess("public", null)).toBe("allowed");
    expect(expectedAccess("service.record", "technician")).toBe("allowed");
    expect(expectedAccess("service.record", "auditor")).toBe("forbidden");
  });
});
