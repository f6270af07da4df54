import { jsonResponse } from "@/lib/server/json-response";
import { NextResponse } from "next/server";
import { apiRoute } from "@/lib/server/api";
import { TooManyRequestsError, UnauthorizedError } from "@/lib/server/errors";
import { clientAddress } from "@/lib/server/request";
import { invalidateSessionToken, sessionCookie } from "@/lib/server/session";
import { signIn } from "@/lib/server/sign-in";
import { signInSchema } from "@/lib/validation/auth";

export const dynamic = "force-dynamic";

/** Sign in: 200 with the user and the session cookie; 401 the same for every bad combination; 429 when throttled. */
export const POST = apiRoute({ public: true, body: signInSchema }, async ({ request, body }) => {
  const result = await signIn({
    email: body.email,
    password: body.password,
    address: clientAddress(request.headers),
    userAgent: request.headers.get("user-agent"),
  });
  if (!result.ok) {
    if (result.reason === "too_many_attempts") throw new TooManyRequestsError(result.retryAfterSeconds);
    throw new UnauthorizedError("The e-mail address or the password is not right.", "invalid_credentials");
  }
  const cookie = sessionCookie();
  // Whatever session this browser held before is ended: a sign-in never leaves the old token usable.
  await invalidateSessionToken(request.cookies.get(cookie.name)?.value);
  const response = jsonResponse({ user: result.user });
  response.cookies.set(cookie.name, result.token, cookie.attributes);
  return response;
});

/** Sign out: the session row is deleted, the cookie cleared. */
export const DELETE = apiRoute({ public: true }, async ({ request }) => {
  const cookie = sessionCookie();
  await invalidateSessionToken(request.cookies.get(cookie.name)?.value);
  const response = new NextResponse(null, { status: 204 });
  response.cookies.set(cookie.name, "", { ...cookie.attributes, maxAge: 0 });
  return response;
});
