import { afterEach, describe, expect, it, vi } from "vitest";
import { noteDatabaseAnswered, toAppError } from "@/lib/server/errors";

// The shapes below are what the drivers throw (seen in the fault tests, tests/integration/faults.test.ts).
const driverError = (code: string, sqlState: string, message: string) =>
  Object.assign(new Error(message), { code, sqlState, fatal: true });
const sequelizeWrapped = (parent: Error) =>
  Object.assign(new Error(parent.message), { name: "SequelizeDatabaseError", parent, original: parent });

afterEach(() => vi.restoreAllMocks());

describe("toAppError and a database that went away", () => {
  it.each([
    ["a socket closed mid-statement, wrapped by Sequelize", sequelizeWrapped(driverError("ER_SOCKET_UNEXPECTED_CLOSE", "08S01", "socket has unexpectedly been closed"))],
    ["the bulk pool giving up on a connection", driverError("ER_GET_CONNECTION_TIMEOUT", "HY000", "retrieve connection from pool timeout")],
    ["a refused connection (mysql2)", Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" })],
    ["a session read that timed out (mysql2)", Object.assign(new Error("Query inactivity timeout"), { code: "PROTOCOL_SEQUENCE_TIMEOUT" })],
    ["a server shutting down", sequelizeWrapped(driverError("ER_SERVER_SHUTDOWN", "08S01", "Server shutdown in progress"))],
    ["Sequelize's own refusal", Object.assign(new Error("refused"), { name: "SequelizeConnectionRefusedError" })],
  ])("%s is a 503 naming the database", (_what, error) => {
    vi.spyOn(console, "error").mockImplementation(() => {});
    const mapped = toAppError(error);
    expect(mapped.status).toBe(503);
    expect(mapped.code).toBe("service_unavailable");
    expect(mapped.message).toMatch(/database/);
    expect(mapped.headers).toMatchObject({ "Retry-After": expect.any(String) });
  });

  it("a duplicate key or a bad statement stays a 500", () => {
    vi.spyOn(console, "error").mockImplementation(() => {});
    expect(toAppError(sequelizeWrapped(driverError("ER_DUP_ENTRY", "23000", "Duplicate entry"))).status).toBe(500);
    expect(toAppError(new TypeError("x is undefined")).status).toBe(500);
  });

  it("an outage is logged once a while, not once per refused request", () => {
    vi.useFakeTimers();
    try {
      const later = Date.now() + 86_400_000; // far from any earlier line of this process
      noteDatabaseAnswered();
      const lines: string[] = [];
      vi.spyOn(console, "error").mockImplementation((line: string) => void lines.push(line));
      const refused = () => toAppError(Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" }));
      vi.setSystemTime(later);
      for (let i = 0; i < 50; i++) refused();
      expect(lines.filter((l) => l.includes("database_unavailable"))).toHaveLength(1);
      vi.setSystemTime(later + 11_000);
      refused();
      const outage = lines.filter((l) => l.includes("database_unavailable"));
      expect(outage).toHaveLength(2);
      expect(JSON.parse(outage[1]!)).toMatchObject({ level: "error", code: "ECONNREFUSED", alsoRefusedSinceLastLine: 49 });
      // The database answered again: the next failure is a new outage, logged at once.
      vi.setSystemTime(later + 12_000);
      refused();
      expect(lines.filter((l) => l.includes("database_unavailable"))).toHaveLength(2);
      noteDatabaseAnswered();
      refused();
      expect(lines.filter((l) => l.includes("database_unavailable"))).toHaveLength(3);
    } finally {
      vi.useRealTimers();
    }
  });
});
