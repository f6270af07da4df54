import { afterEach, describe, expect, it, vi } from "vitest";
import { log } from "@/lib/server/log";

afterEach(() => vi.restoreAllMocks());

const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

describe("log: one JSON record per line, written together at the end of the turn", () => {
  it("writes the lines of one turn with one write, each a record of its own", async () => {
    const writes: string[] = [];
    vi.spyOn(process.stdout, "write").mockImplementation((chunk: string | Uint8Array) => {
      writes.push(String(chunk));
      return true;
    });
    log("info", "first", { n: 1 });
    log("warn", "second", { text: "a\nforged line" });
    expect(writes).toHaveLength(0);
    await nextTurn();
    expect(writes).toHaveLength(1);
    const lines = writes[0]!.split("\n");
    expect(lines.at(-1)).toBe("");
    const records = lines.slice(0, -1).map((l) => JSON.parse(l) as Record<string, unknown>);
    expect(records.map((r) => [r.level, r.event])).toEqual([
      ["info", "first"],
      ["warn", "second"],
    ]);
    expect(records[1]!.text).toBe("a\nforged line");
    expect(new Date(String(records[0]!.at)).toISOString()).toBe(records[0]!.at);
  });

  it("an error goes out at once, after the lines waiting before it", () => {
    const order: string[] = [];
    vi.spyOn(process.stdout, "write").mockImplementation((chunk: string | Uint8Array) => {
      order.push(`out:${String(chunk)}`);
      return true;
    });
    vi.spyOn(console, "error").mockImplementation((line: string) => void order.push(`err:${line}`));
    log("info", "before");
    log("error", "broken", { code: "x" });
    expect(order).toHaveLength(2);
    expect(order[0]).toMatch(/^out:.*"event":"before"/);
    expect(order[1]).toMatch(/^err:.*"event":"broken"/);
  });
});
