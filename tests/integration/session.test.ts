import { createHash } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { SESSION_TIMEOUTS } from "@/lib/domain/auth/session-policy";
import { ROLES } from "@/lib/domain/permissions";
import { Client, createUser, rootQuery, uniqueEmail } from "./helpers";

const sha256 = (s: string) => createHash("sha256").update(s).digest("hex");

afterAll(async () => {
  await rootQuery("DELETE FROM sign_in_throttle");
});

describe("POST /api/v1/session", () => {
  it("signs in with the demo lead and answers GET /api/v1/me", async () => {
    const client = new Client();
    const response = await client.signIn("lead@example.com");
    expect(response.status).toBe(200);
    expect(response.body.user).toMatchObject({ email: "lead@example.com", role: "lead" });
    expect(Object.keys(response.body.user).sort()).toEqual(["email", "id", "name", "role"]);
    const me = await client.request("GET", "/api/v1/me");
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe("lead@example.com");
  });

  it("gives the same 401 body for a wrong password and an unknown user", async () => {
    const wrong = await new Client().signIn("clerk@example.com", "not-the-password");
    const unknown = await new Client().signIn(uniqueEmail("nobody"), "not-the-password");
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.text).toBe(unknown.text);
    expect(wrong.body.error.code).toBe("invalid_credentials");
  });

  it("names the bad field on malformed input and never answers 500", async () => {
    const response = await new Client().request("POST", "/api/v1/session", { json: { email: "x", password: 5 } });
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields).sort()).toEqual(["email", "password"]);
    const broken = await new Client().request("POST", "/api/v1/session", { body: "{not json", headers: { "content-type": "application/json" } });
    expect(broken.status).toBe(400);
  });

  it("sets an HttpOnly, SameSite=Lax cookie and stores only the token's SHA-256", async () => {
    const client = new Client();
    const user = await createUser({ email: uniqueEmail("hash"), role: "clerk" });
    const response = await client.signIn(user.email, user.password);
    const setCookie = response.headers.get("set-cookie") ?? "";
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=lax/i);
    expect(setCookie).toMatch(/Path=\//);
    expect(setCookie).not.toMatch(/Domain=/i);
    const token = client.cookies.get("gl_session")!;
    expect(token.length).toBeGreaterThanOrEqual(27); // 160 bits in base64url
    const rows = await rootQuery<{ id: string }>("SELECT id FROM user_session WHERE user_id = ?", [user.id]);
    expect(rows).toHaveLength(1);
    expect(rows[0]!.id).toBe(sha256(token));
    expect(rows[0]!.id).not.toContain(token);
  });

  it("logout replay: DELETE ends the session on the server; replaying the cookie gives 401", async () => {
    const client = new Client();
    await client.signIn("tech@example.com");
    const token = client.cookies.get("gl_session")!;
    expect((await client.request("DELETE", "/api/v1/session")).status).toBe(204);
    const replay = new Client();
    replay.cookies.set("gl_session", token);
    expect((await replay.request("GET", "/api/v1/me")).status).toBe(401);
    expect(await rootQuery("SELECT id FROM user_session WHERE id = ?", [sha256(token)])).toHaveLength(0);
  });

  it("fixation: a new sign-in gives a new token; a planted cookie is not adopted", async () => {
    const client = new Client();
    client.cookies.set("gl_session", "planted-value-chosen-by-attacker");
    await client.signIn("auditor@example.com");
    expect(client.cookies.get("gl_session")).not.toBe("planted-value-chosen-by-attacker");
    const planted = new Client();
    planted.cookies.set("gl_session", "planted-value-chosen-by-attacker");
    expect((await planted.request("GET", "/api/v1/me")).status).toBe(401);
  });

  it("fixation: a real session token held before sign-in is ended by the sign-in", async () => {
    // Someone signs in on a shared device (or hands a victim their own token); the next person signs in there.
    const first = await createUser({ email: uniqueEmail("before"), role: "technician" });
    const second = await createUser({ email: uniqueEmail("after"), role: "clerk" });
    const device = new Client();
    await device.signIn(first.email, first.password);
    const before = device.cookies.get("gl_session")!;
    expect((await device.signIn(second.email, second.password)).status).toBe(200);
    const after = device.cookies.get("gl_session")!;
    expect(after).not.toBe(before);
    expect((await device.request("GET", "/api/v1/me")).body.user.email).toBe(second.email);
    const old = new Client();
    old.cookies.set("gl_session", before);
    expect((await old.request("GET", "/api/v1/me")).status).toBe(401);
    expect(await rootQuery("SELECT id FROM user_session WHERE id = ?", [sha256(before)])).toHaveLength(0);
  });

  it("logout replay: the ended cookie cannot write either, and a second logout changes nothing", async () => {
    const client = new Client();
    await client.signIn("lead@example.com");
    const token = client.cookies.get("gl_session")!;
    expect((await client.request("DELETE", "/api/v1/session")).status).toBe(204);
    const replay = new Client();
    replay.cookies.set("gl_session", token);
    const write = await replay.request("POST", "/api/v1/calculations/consistency", { json: { workedPenetration: 280 } });
    expect(write.status).toBe(401);
    expect(write.body.error.code).toBe("unauthenticated");
    expect((await replay.request("DELETE", "/api/v1/session")).status).toBe(204);
    expect((await replay.request("GET", "/api/v1/me")).status).toBe(401);
  });
});

describe("sessions end on the server", () => {
  it("disabling ends sessions: a disabled user's session gives 401 at once", async () => {
    const user = await createUser({ email: uniqueEmail("disabled"), role: "technician" });
    const client = new Client();
    expect((await client.signIn(user.email, user.password)).status).toBe(200);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(200);
    await rootQuery("UPDATE app_user SET status = 'disabled' WHERE id = ?", [user.id]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(401);
    expect(await rootQuery("SELECT id FROM user_session WHERE user_id = ?", [user.id])).toHaveLength(0);
  });

  it("idle timeout: a session expires after 30 minutes without a request (technician)", async () => {
    const user = await createUser({ email: uniqueEmail("idle"), role: "technician" });
    const client = new Client();
    await client.signIn(user.email, user.password);
    await rootQuery("UPDATE user_session SET last_seen_at = ? WHERE user_id = ?", [new Date(Date.now() - 29 * 60_000), user.id]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(200);
    await rootQuery("UPDATE user_session SET last_seen_at = ? WHERE user_id = ?", [new Date(Date.now() - 31 * 60_000), user.id]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(401);
  });

  it("absolute timeout: a session past its limit expires although it is in use (lead: 8 hours)", async () => {
    const user = await createUser({ email: uniqueEmail("absolute"), role: "lead" });
    const client = new Client();
    await client.signIn(user.email, user.password);
    await rootQuery("UPDATE user_session SET created_at = ?, last_seen_at = ? WHERE user_id = ?", [
      new Date(Date.now() - 8 * 3_600_000 - 1000),
      new Date(),
      user.id,
    ]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(401);
  });

  it.each(ROLES)("idle timeout: %s — usable 5 s before the idle limit, gone 1 s after it", async (role) => {
    const user = await createUser({ email: uniqueEmail(`idle-${role}`), role });
    const client = new Client();
    expect((await client.signIn(user.email, user.password)).status).toBe(200);
    const idleMs = SESSION_TIMEOUTS[role].idleMinutes * 60_000;
    await rootQuery("UPDATE user_session SET last_seen_at = ? WHERE user_id = ?", [new Date(Date.now() - idleMs + 5_000), user.id]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(200);
    await rootQuery("UPDATE user_session SET last_seen_at = ? WHERE user_id = ?", [new Date(Date.now() - idleMs - 1_000), user.id]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(401);
    expect(await rootQuery("SELECT id FROM user_session WHERE user_id = ?", [user.id])).toHaveLength(0);
  });

  it.each(ROLES)("absolute timeout: %s — in use all along, usable 5 s before the limit, gone 1 s after it", async (role) => {
    const user = await createUser({ email: uniqueEmail(`absolute-${role}`), role });
    const client = new Client();
    expect((await client.signIn(user.email, user.password)).status).toBe(200);
    const absoluteMs = SESSION_TIMEOUTS[role].absoluteHours * 3_600_000;
    await rootQuery("UPDATE user_session SET created_at = ?, last_seen_at = ? WHERE user_id = ?", [new Date(Date.now() - absoluteMs + 5_000), new Date(), user.id]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(200);
    await rootQuery("UPDATE user_session SET created_at = ?, last_seen_at = ? WHERE user_id = ?", [new Date(Date.now() - absoluteMs - 1_000), new Date(), user.id]);
    expect((await client.request("GET", "/api/v1/me")).status).toBe(401);
    expect(await rootQuery("SELECT id FROM user_session WHERE user_id = ?", [user.id])).toHaveLength(0);
  });

  it("no session gives 401 with the API error body", async () => {
    const response = await new Client().request("GET", "/api/v1/me");
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe("unauthenticated");
  });
});

describe("cross-origin writes to route handlers are refused", () => {
  const body = JSON.stringify({ email: "lead@example.com", password: "demo-grease-2026" });
  const own = new URL(process.env.APP_URL!).origin;
  it.each([
    ["no Origin header", { "content-type": "application/json" }],
    ["a foreign Origin", { "content-type": "application/json", origin: "https://evil.example" }],
    ["Sec-Fetch-Site: cross-site", { "content-type": "application/json", origin: own, "sec-fetch-site": "cross-site" }],
  ])("%s → 403 and no session", async (_label, headers) => {
    const response = await fetch(new URL("/api/v1/session", own), { method: "POST", headers, body });
    expect(response.status).toBe(403);
    expect(response.headers.get("set-cookie")).toBeNull();
    expect(((await response.json()) as { error: { code: string } }).error.code).toBe("cross_origin");
  });

  it("a same-origin text/plain form post of JSON gets 415, not a session", async () => {
    const response = await new Client().request("POST", "/api/v1/session", { body, headers: { "content-type": "text/plain" } });
    expect(response.status).toBe(415);
    expect(response.headers.get("set-cookie")).toBeNull();
  });
});

describe("security headers", () => {
  it.each(["/sign-in", "/api/v1/me", "/api/v1/health", "/no-such-page"])("are on %s", async (pathname) => {
    const response = await fetch(new URL(pathname, process.env.APP_URL), { redirect: "manual" });
    const csp = response.headers.get("content-security-policy") ?? "";
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("base-uri 'none'");
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("referrer-policy")).toBe("same-origin");
  });

  // The API skips the proxy: its headers are the fixed ones from next.config.mjs, on reads and on writes alike.
  // The third address holds a percent-escape that decodes: the proxy sees it and must add nothing of a page's.
  it.each([
    ["GET", "/api/v1/health", undefined, 200],
    ["POST", "/api/v1/session", JSON.stringify({ email: "nobody@example.test", password: "x" }), 401],
    ["GET", "/api/v1/greases/%31", undefined, 401],
  ])("the API's %s %s lets nothing load or run and carries no nonce", async (method, pathname, body, status) => {
    const url = new URL(pathname, process.env.APP_URL);
    const response = await fetch(url, {
      method,
      body,
      headers: body ? { "content-type": "application/json", origin: url.origin } : {},
    });
    expect(response.status).toBe(status);
    // Nothing may load or run; inline style only, which the browser's own viewers of an image or JSON use.
    expect(response.headers.get("content-security-policy")).toBe(
      "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; object-src 'none'; base-uri 'none'",
    );
    expect(response.headers.get("permissions-policy")).toBe("camera=(self), microphone=(), geolocation=()");
    expect(response.headers.get("x-frame-options")).toBe("DENY");
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("a page keeps its nonce policy", async () => {
    const response = await fetch(new URL("/sign-in", process.env.APP_URL), { redirect: "manual" });
    expect(response.headers.get("content-security-policy")).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+'/);
  });

  it.each(["/sign-in", "/api/v1/health"])("%s behind HTTPS (X-Forwarded-Proto) asks for HSTS", async (pathname) => {
    const url = new URL(pathname, process.env.APP_URL);
    const plain = await fetch(url, { redirect: "manual" });
    const secure = await fetch(url, { redirect: "manual", headers: { "x-forwarded-proto": "https" } });
    expect(plain.headers.get("strict-transport-security")).toBeNull();
    expect(secure.headers.get("strict-transport-security")).toBe("max-age=31536000; includeSubDomains");
  });
});

describe("the mark", () => {
  it("the sign-in page links our SVG icon, and /favicon.ico is there for what asks for it by name", async () => {
    const html = await (await fetch(new URL("/sign-in", process.env.APP_URL))).text();
    const href = /<link rel="icon" href="([^"]+)"[^>]*type="image\/svg\+xml"/.exec(html)?.[1];
    expect(href).toMatch(/^\/icon\.svg/);
    const icon = await fetch(new URL(href!, process.env.APP_URL));
    expect(icon.headers.get("content-type")).toBe("image/svg+xml");
    expect(await icon.text()).toContain("<svg");
    const ico = await fetch(new URL("/favicon.ico", process.env.APP_URL));
    expect(ico.status).toBe(200);
    // An ICO file starts with reserved 0, type 1 (icon).
    expect([...new Uint8Array(await ico.arrayBuffer()).slice(0, 4)]).toEqual([0, 0, 1, 0]);
  });
});
