import { z } from "zod";
import { ROUTE_POLICY } from "@/lib/domain/permissions/endpoints";
import { signInSchema } from "@/lib/validation/auth";
import { relubricationSchema, viscosityCalcSchema } from "@/lib/validation/calculations";
import { consistencySchema, evaluateSchema, evidenceSchema } from "@/lib/validation/compatibility";
import { greasePatchSchema, greaseSchema } from "@/lib/validation/grease";
import { incidentExportSchema, incidentFilterSchema } from "@/lib/validation/incidents";
import { pointsQuerySchema, serviceSchema } from "@/lib/validation/points";
import { serviceExportSchema } from "@/lib/validation/service-export";
import { issueLiveSchema, lotsQuerySchema, receiptSchema } from "@/lib/validation/stock";

/**
 * The request bodies the route handlers validate, by "METHOD path" as in ROUTE_POLICY: the very schema objects the
 * handlers use (tests/unit/server/openapi.test.ts reads each route file and holds this list to it).
 */
export const REQUEST_BODIES: Readonly<Record<string, z.ZodType>> = {
  "POST /api/v1/session": signInSchema,
  "POST /api/v1/calculations/consistency": consistencySchema,
  "POST /api/v1/calculations/relubrication": relubricationSchema,
  "POST /api/v1/calculations/viscosity": viscosityCalcSchema,
  "POST /api/v1/compatibility/evaluate": evaluateSchema,
  "POST /api/v1/greases": greaseSchema,
  "PATCH /api/v1/greases/[id]": greasePatchSchema,
  "POST /api/v1/points/[tag]/services": serviceSchema,
  "POST /api/v1/stock/issues": issueLiveSchema,
  "POST /api/v1/stock/receipts": receiptSchema,
};

/** Multipart uploads: the form's fields (the JSON part, where there is one, by its schema). */
const MULTIPART_BODIES: Readonly<Record<string, { fields: Record<string, z.ZodType | "file" | "text"> }>> = {
  "POST /api/v1/compatibility/evidence": { fields: { payload: evidenceSchema, file: "file" } },
  "POST /api/v1/greases/[id]/documents": { fields: { kind: "text", file: "file" } },
};

/** Query strings the route handlers validate, by "METHOD path". */
export const QUERY_PARAMETERS: Readonly<Record<string, z.ZodType>> = {
  "GET /api/v1/points": pointsQuerySchema,
  "GET /api/v1/incidents": incidentFilterSchema,
  "GET /api/v1/incidents/export": incidentExportSchema,
  "GET /api/v1/services/export": serviceExportSchema(new Date(0)),
  "GET /api/v1/stock/lots": lotsQuerySchema,
};

/** Writes that take an Idempotency-Key (a phone may retry them). */
const IDEMPOTENT = new Set(["POST /api/v1/points/[tag]/services", "POST /api/v1/stock/issues", "POST /api/v1/stock/receipts"]);

/** Answers that are files rather than JSON. */
const FILE_ANSWERS: Readonly<Record<string, string>> = {
  "GET /api/v1/points/[tag]/qr.svg": "image/svg+xml",
  "GET /api/v1/points/[tag]/qr.png": "image/png",
  "GET /api/v1/stock/labels/[code]/qr.svg": "image/svg+xml",
  "GET /api/v1/stock/labels/[code]/qr.png": "image/png",
  "GET /api/v1/stock/labels/[code]/delivery-note": "application/pdf",
  "GET /api/v1/greases/[id]/documents/[kind]": "application/pdf",
  "GET /api/v1/compatibility/evidence/[id]/document": "application/pdf",
  "GET /api/v1/greases/export": "text/csv",
  "GET /api/v1/incidents/export": "text/csv",
  "GET /api/v1/services/export": "text/csv",
};

const CREATED = new Set([
  "POST /api/v1/greases",
  "POST /api/v1/greases/[id]/documents",
  "POST /api/v1/compatibility/evidence",
  "POST /api/v1/points/[tag]/services",
  "POST /api/v1/stock/issues",
  "POST /api/v1/stock/receipts",
]);

/** What a value may look like on the way in (what the client sends), as JSON Schema 2020-12. */
function jsonSchema(schema: z.ZodType): Record<string, unknown> {
  const out = z.toJSONSchema(schema, { target: "draft-2020-12", io: "input", unrepresentable: "any" }) as Record<string, unknown>;
  delete out.$schema;
  return out;
}

const ERROR_CODES: Record<string, string> = {
  "400": "Validation failed: `fields` names each bad field.",
  "401": "No session, or it has expired.",
  "403": "Your role or site may not do this.",
  "404": "No such object among yours.",
  "409": "Conflict: blocked mix, insufficient stock, stale version, or the same Idempotency-Key still in flight.",
  "413": "The upload is larger than allowed.",
  "415": "The upload is not of an accepted type.",
  "422": "This Idempotency-Key was used for a different request.",
  "429": "Too many attempts; see Retry-After.",
  "503": "The database is not answering; try again (see Retry-After).",
};

function errorsFor(key: string, method: string, isPublic: boolean): string[] {
  const codes = ["400", "503"];
  if (!isPublic) codes.push("401", "403");
  if (key.includes("[")) codes.push("404");
  if (method !== "GET") codes.push("409");
  if (MULTIPART_BODIES[key]) codes.push("413", "415");
  if (IDEMPOTENT.has(key)) codes.push("422");
  if (key === "POST /api/v1/session") codes.push("429");
  return [...new Set(codes)].sort();
}

/** The OpenAPI 3.1 description of the routes in ROUTE_POLICY, with the request schemas the handlers validate with. */
export function openApiDocument(): Record<string, unknown> {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const [key, rule] of Object.entries(ROUTE_POLICY)) {
    const [method, route] = key.split(" ") as [string, string];
    const path = route.replace(/\[(\w+)\]/g, "{$1}");
    const isPublic = rule === "public";
    const parameters: Record<string, unknown>[] = [...route.matchAll(/\[(\w+)\]/g)].map((m) => ({
      name: m[1],
      in: "path",
      required: true,
      schema: { type: "string" },
    }));
    const query = QUERY_PARAMETERS[key];
    if (query) {
      const schema = jsonSchema(query) as { properties?: Record<string, unknown>; required?: string[]; allOf?: { properties?: Record<string, unknown>; required?: string[] }[] };
      const parts = schema.allOf ?? [schema];
      for (const part of parts)
        for (const [name, property] of Object.entries(part.properties ?? {}))
          parameters.push({ name, in: "query", required: part.required?.includes(name) ?? false, schema: property });
    }
    if (IDEMPOTENT.has(key))
      parameters.push({
        name: "Idempotency-Key",
        in: "header",
        required: false,
        description: "1–255 printable characters, e.g. a UUID: the first answer is stored and replayed to a retry.",
        schema: { type: "string", minLength: 1, maxLength: 255 },
      });
    const operation: Record<string, unknown> = {
      operationId: `${method.toLowerCase()}${route.replace(/\[(\w+)\]/g, "By-$1").replace(/[^A-Za-z0-9]+(.)?/g, (_m, c: string | undefined) => (c ? c.toUpperCase() : ""))}`,
      "x-permission": rule,
      security: isPublic ? [] : [{ session: [] }],
    };
    if (parameters.length) operation.parameters = parameters;
    const body = REQUEST_BODIES[key];
    if (body) operation.requestBody = { required: true, content: { "application/json": { schema: jsonSchema(body) } } };
    const multipart = MULTIPART_BODIES[key];
    if (multipart)
      operation.requestBody = {
        required: true,
        content: {
          "multipart/form-data": {
            schema: {
              type: "object",
              properties: Object.fromEntries(
                Object.entries(multipart.fields).map(([name, f]) => [
                  name,
                  f === "file"
                    ? { type: "string", contentMediaType: "application/pdf" }
                    : f === "text"
                      ? { type: "string" }
                      : { type: "string", contentMediaType: "application/json", contentSchema: jsonSchema(f) },
                ]),
              ),
            },
          },
        },
      };
    const success = method === "DELETE" ? "204" : CREATED.has(key) ? "201" : "200";
    const file = FILE_ANSWERS[key];
    operation.responses = {
      [success]: {
        description: success === "204" ? "Done." : "The answer.",
        ...(success === "204" ? {} : { content: { [file ?? "application/json"]: {} } }),
      },
      ...Object.fromEntries(
        errorsFor(key, method, isPublic).map((code) => [
          code,
          { description: ERROR_CODES[code], content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
        ]),
      ),
    };
    (paths[path] ??= {})[method.toLowerCase()] = operation;
  }
  return {
    openapi: "3.1.0",
    info: {
      title: "Greaseledger API",
      version: "1",
      description:
        "Grease compatibility and lubricant inventory. JSON in and out; quantities carry their unit in the field name. " +
        "Generated from the schemas the server validates requests with.",
    },
    components: {
      securitySchemes: { session: { type: "apiKey", in: "cookie", name: "gl_session", description: "Set by POST /api/v1/session (`__Host-gl_session` over https)." } },
      schemas: {
        Error: {
          type: "object",
          required: ["error"],
          properties: {
            error: {
              type: "object",
              required: ["code", "message"],
              properties: {
                code: { type: "string", pattern: "^[a-z0-9_]+$" },
                message: { type: "string" },
                fields: { type: "object", additionalProperties: { type: "array", items: { type: "string" } } },
              },
            },
          },
        },
      },
    },
    paths,
  };
}
