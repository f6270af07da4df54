import "server-only";
import type { NextRequest } from "next/server";
import type { z } from "zod";
import { can, type Action } from "@/lib/domain/permissions";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import {
  ForbiddenError,
  UnauthorizedError,
  UnsupportedMediaTypeError,
  ValidationError,
  errorResponse,
} from "./errors";
import { log } from "./log";
import { crossOriginProblem } from "./request";
import { withRequestContext } from "./request-context";
import { sessionCookie, validateSessionToken, type SessionUser } from "./session";

const MAX_JSON_BYTES = 256 * 1024;

interface HandlerArgs<B, P> {
  request: NextRequest;
  user: SessionUser;
  body: B;
  params: P;
}

interface RouteOptions<S extends z.ZodType | undefined> {
  /** The action the caller's role must be allowed. Omit only with `public: true`. */
  action?: Action;
  public?: boolean;
  body?: S;
}

type Ctx<P> = { params: Promise<P> };

/**
 * Wraps a route handler in the same steps every time: same-origin check on writes, session, role,
 * JSON body parsed with the shared schema, then the handler; any error becomes the API error body.
 */
export function apiRoute<P = Record<string, string>, S extends z.ZodType | undefined = undefined>(
  options: RouteOptions<S>,
  handler: (args: HandlerArgs<S extends z.ZodType ? z.output<S> : undefined, P>) => Promise<Response>,
) {
  return async (request: NextRequest, context: Ctx<P>): Promise<Response> => {
    try {
      const problem = crossOriginProblem(request.method, request.headers);
      if (problem) {
        log("warn", "csrf_rejected", { via: "route", path: request.nextUrl.pathname, problem });
        throw new ForbiddenError(`Refused: ${problem}. Writes must come from this site.`, "cross_origin");
      }

      let user: SessionUser | null = null;
      let siteIds: number[] = [];
      if (!options.public) {
        const session = await validateSessionToken(request.cookies.get(sessionCookie().name)?.value);
        if (!session) throw new UnauthorizedError();
        user = session.user;
        siteIds = session.siteIds;
        if (!options.action || !can(user.role, options.action)) {
          log("warn", "forbidden", { userId: user.id, action: options.action, path: request.nextUrl.pathname });
          throw new ForbiddenError();
        }
      }

      let body: unknown = undefined;
      if (options.body) body = await readJson(request, options.body);

      const params = (await context.params) ?? ({} as P);
      const run = () =>
        handler({
          request,
          user: user as SessionUser,
          body: body as S extends z.ZodType ? z.output<S> : undefined,
          params,
        });
      return await (user ? withRequestContext({ userId: user.id, siteIds }, run) : run());
    } catch (error) {
      return errorResponse(error);
    }
  };
}

async function readJson(request: NextRequest, schema: z.ZodType): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/json\b/i.test(type)) throw new UnsupportedMediaTypeError();
  const text = await request.text();
  if (text.length > MAX_JSON_BYTES) throw new ValidationError({ body: ["The body is too large."] });
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new ValidationError({ body: ["The body is not valid JSON."] }, "The body is not valid JSON.");
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  return parsed.data;
}
