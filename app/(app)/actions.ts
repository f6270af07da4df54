"use server";

import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { log } from "@/lib/server/log";
import { crossOriginProblem } from "@/lib/server/request";
import { invalidateSessionToken, sessionCookie } from "@/lib/server/session";

/**
 * Ends the caller's session. Needs no role (signing out is always allowed, with or without a live
 * session), but a request from another site, or one without an Origin, is refused like every action.
 */
export async function signOutAction(): Promise<void> {
  const problem = crossOriginProblem("POST", await headers());
  if (problem) {
    log("warn", "csrf_rejected", { via: "server_action", problem });
    return;
  }
  const jar = await cookies();
  const cookie = sessionCookie();
  await invalidateSessionToken(jar.get(cookie.name)?.value);
  jar.set(cookie.name, "", { ...cookie.attributes, maxAge: 0 });
  redirect("/sign-in");
}
