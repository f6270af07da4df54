import { afterAll, describe, expect, it } from "vitest";
import { Client, freePort, rootQuery, startAppInstance, uniqueEmail } from "./helpers";

afterAll(async () => {
  await rootQuery("DELETE FROM sign_in_throttle");
});

describe("sign-in throttling kept in MariaDB", () => {
  it("20 wrong passwords end in 429 with Retry-After, and the lock survives an app restart", async () => {
    const email = uniqueEmail("throttled");
    const port = await freePort();
    let app = await startAppInstance(port);
    const statuses: number[] = [];
    let last: Awaited<ReturnType<Client["signIn"]>> | undefined;
    try {
      const client = new Client(app.url);
      for (let i = 0; i < 20; i++) {
        last = await client.signIn(email, `wrong-${i}`);
        statuses.push(last.status);
      }
    } finally {
      await app.stop();
    }
    expect(statuses.slice(0, 4)).toEqual([401, 401, 401, 401]);
    expect(statuses.at(-1)).toBe(429);
    expect(statuses.every((s) => s === 401 || s === 429)).toBe(true);
    expect(last!.body.error.code).toBe("too_many_attempts");
    expect(Number(last!.headers.get("retry-after"))).toBeGreaterThan(0);

    app = await startAppInstance(port);
    try {
      const afterRestart = await new Client(app.url).signIn(email, "wrong-again");
      expect(afterRestart.status).toBe(429);
      expect(Number(afterRestart.headers.get("retry-after"))).toBeGreaterThan(60);
    } finally {
      await app.stop();
    }
  });

  it("while locked, even the right password is not checked", async () => {
    const email = "clerk@example.com";
    await rootQuery(
      "INSERT INTO sign_in_throttle (throttle_key, failures, window_started_at, locked_until, updated_at) VALUES (?, 10, ?, ?, ?)",
      [`account:${email}`, new Date(), new Date(Date.now() + 600_000), new Date()],
    );
    const response = await new Client().signIn(email);
    expect(response.status).toBe(429);
    await rootQuery("DELETE FROM sign_in_throttle WHERE throttle_key = ?", [`account:${email}`]);
    expect((await new Client().signIn(email)).status).toBe(200);
  });
});
