import "server-only";
import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { cache } from "react";
import { can, type Action } from "@/lib/domain/permissions";
import { ForbiddenError, UnauthorizedError } from "./errors";
import { log } from "./log";
import { crossOriginProblem } from "./request";
import { sessionCookie, validateSessionToken, type SessionUser, type ValidSession } from "./session";

/** The signed-in session of the current page request, once per request. */
export const getCurrentSession = cache(async (): Promise<ValidSession | null> => {
  const jar = await cookies();
  return validateSessionToken(jar.get(sessionCookie().name)?.value);
});

/** A same-site path to return to after sign-in; anything else (other hosts, odd schemes) is dropped. */
export function safeNextPath(raw: string | null | undefined): string | null {
  if (!raw || !raw.startsWith("/") || raw.startsWith("//") || raw.startsWith("/\\") || raw.length > 500) return null;
  if (raw.startsWith("/sign-in") || raw.startsWith("/api/")) return null;
  return raw;
}

/** For pages: the signed-in user, or a redirect to sign-in that comes back here afterwards. */
export async function requirePageUser(): Promise<SessionUser> {
  const session = await getCurrentSession();
  if (!session) {
    const next = safeNextPath((await headers()).get("x-pathname"));
    redirect(next && next !== "/overview" ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
  }
  return session.user;
}

/** For pages: whether the signed-in user may do an action (the page shows a refusal when not). */
export async function pageUserCan(action: Action): Promise<{ user: SessionUser; allowed: boolean }> {
  const user = await requirePageUser();
  return { user, allowed: can(user.role, action) };
}

/**
 * For server actions: checks the request's origin (a missing Origin is refused too), the session and
 * the role. Throws UnauthorizedError / ForbiddenError.
 */
export async function requireActionUser(action: Action): Promise<SessionUser> {
  const problem = crossOriginProblem("POST", await headers());
  if (problem) {
    log("warn", "csrf_rejected", { via: "server_action", problem });
    throw new ForbiddenError("This form was sent from another site and was refused.", "cross_origin");
  }
  const session = await getCurrentSession();
  if (!session) throw new UnauthorizedError();
  if (!can(session.user.role, action)) {
    log("warn", "forbidden", { userId: session.user.id, action });
    throw new ForbiddenError();
  }
  return session.user;
}
