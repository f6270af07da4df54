import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ROUTE_POLICY } from "@/lib/domain/permissions/endpoints";
import { openApiDocument, QUERY_PARAMETERS, REQUEST_BODIES } from "@/lib/server/openapi";

type Operation = {
  "x-permission": string;
  security: unknown[];
  parameters?: { name: string; in: string; required: boolean }[];
  requestBody?: { content: Record<string, { schema: { required?: string[]; properties?: Record<string, unknown> } }> };
  responses: Record<string, unknown>;
};
const doc = openApiDocument() as { openapi: string; paths: Record<string, Record<string, Operation>> };
const operation = (key: string) => {
  const [method, route] = key.split(" ") as [string, string];
  return doc.paths[route.replace(/\[(\w+)\]/g, "{$1}")]?.[method.toLowerCase()];
};

/** Every route file: its "METHOD path" keys and its source. */
function routeFiles(): { keys: string[]; source: string; file: string }[] {
  const root = path.resolve(__dirname, "../../../app/api");
  const out: { keys: string[]; source: string; file: string }[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir)) {
      const full = path.join(dir, entry);
      if (statSync(full).isDirectory()) walk(full);
      else if (entry === "route.ts") {
        const source = readFileSync(full, "utf8");
        const route = `/api/${path.relative(root, path.dirname(full)).split(path.sep).join("/")}`;
        const methods = [...source.matchAll(/export const (GET|POST|PATCH|PUT|DELETE)\b/g)].map((m) => m[1]!);
        out.push({ keys: methods.map((m) => `${m} ${route}`), source, file: full });
      }
    }
  };
  walk(root);
  return out;
}

describe("GET /api/v1/openapi.json (API.md, Documentation)", () => {
  it("is OpenAPI 3.1 and plain JSON", () => {
    expect(doc.openapi).toBe("3.1.0");
    expect(JSON.parse(JSON.stringify(doc))).toEqual(doc);
  });

  it("describes every route handler, with the permission and the session it needs", () => {
    for (const [key, rule] of Object.entries(ROUTE_POLICY)) {
      const op = operation(key);
      expect(op, key).toBeDefined();
      expect(op!["x-permission"], key).toBe(rule);
      expect(op!.security.length, key).toBe(rule === "public" ? 0 : 1);
      if (rule !== "public") expect(Object.keys(op!.responses), key).toEqual(expect.arrayContaining(["401", "403"]));
    }
    const described = Object.entries(doc.paths).flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${p}`));
    expect(described).toHaveLength(Object.keys(ROUTE_POLICY).length);
  });

  it("uses the very schema each handler validates its JSON body with, and no other", async () => {
    for (const { keys, source, file } of routeFiles()) {
      // apiRoute({ …, body: someSchema }) belongs to the export it follows.
      for (const key of keys) {
        const method = key.split(" ")[0]!;
        const declaration = new RegExp(`export const ${method} = apiRoute(?:<[^(]*>)?\\(\\s*\\{[^}]*?body:\\s*(\\w+)`, "s").exec(source);
        if (!declaration) {
          expect(REQUEST_BODIES[key], `${key} has no body schema in ${file}`).toBeUndefined();
          continue;
        }
        const name = declaration[1]!;
        const from = new RegExp(`import \\{[^}]*\\b${name}\\b[^}]*\\} from "@/(lib/validation/[\\w-]+)"`).exec(source);
        expect(from, `${name} imported in ${file}`).not.toBeNull();
        const exported = (await import(`@/${from![1]}`)) as Record<string, unknown>;
        expect(REQUEST_BODIES[key], key).toBe(exported[name]);
      }
    }
  });

  it("lists the query parameters of the handlers that validate a query string", () => {
    for (const { keys, source } of routeFiles())
      for (const key of keys.filter((k) => k.startsWith("GET "))) {
        const uses = /(\w+(?:QuerySchema|FilterSchema|ExportSchema))\b[^;]*\.safeParse\(Object\.fromEntries\(request\.nextUrl\.searchParams\)/.exec(source);
        if (uses) expect(QUERY_PARAMETERS[key], key).toBeDefined();
        else expect(QUERY_PARAMETERS[key], key).toBeUndefined();
      }
    const names = (key: string) => operation(key)!.parameters!.filter((p) => p.in === "query").map((p) => p.name);
    // API.md: GET /api/v1/points?site=&due=, GET /api/v1/incidents?from=&to=.
    expect(names("GET /api/v1/points")).toEqual(expect.arrayContaining(["site", "due"]));
    expect(names("GET /api/v1/incidents")).toEqual(expect.arrayContaining(["from", "to"]));
  });

  it("gives the issue's body as API.md has it, with its Idempotency-Key and its 409", () => {
    const op = operation("POST /api/v1/stock/issues")!;
    const schema = op.requestBody!.content["application/json"]!.schema;
    expect(schema.required).toEqual(["greaseId", "packId", "quantity"]);
    expect(Object.keys(schema.properties!)).toEqual(expect.arrayContaining(["greaseId", "packId", "quantity", "location"]));
    expect(op.parameters!.find((p) => p.name === "Idempotency-Key")).toMatchObject({ in: "header", required: false });
    expect(Object.keys(op.responses)).toEqual(expect.arrayContaining(["201", "400", "409", "422"]));
    const signIn = operation("POST /api/v1/session")!;
    expect(signIn.requestBody!.content["application/json"]!.schema.required).toEqual(["email", "password"]);
    expect(Object.keys(signIn.responses)).toEqual(expect.arrayContaining(["200", "429"]));
  });
});
