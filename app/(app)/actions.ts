"use server";

import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { requireActionUser } from "@/lib/server/auth";
import { invalidateSessionToken, sessionCookie } from "@/lib/server/session";

export async function signOutAction(): Promise<void> {
  await requireActionUser("account.self").catch(() => null);
  const jar = await cookies();
  const cookie = sessionCookie();
  await invalidateSessionToken(jar.get(cookie.name)?.value);
  jar.set(cookie.name, "", { ...cookie.attributes, maxAge: 0 });
  redirect("/sign-in");
}
