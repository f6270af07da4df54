import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GENESIS_HASH, auditHashInput, auditHashTemplate, fillAuditHashTemplate } from "@/lib/domain/audit";

// The database finishes an entry's hash from this template while it holds the chain head (procedure
// audit_append, migration 0009): the filled-in text must be the very text the chain verifier hashes.
describe("auditHashTemplate", () => {
  const entry = {
    at: "2026-12-02T08:15:00.000Z",
    actorId: "00000000-0000-4000-8000-000000000002",
    siteId: 1,
    event: "stock.issued",
    subjectType: "grease",
    subjectId: "1",
    payload: { lots: [{ label: "1X5EGEA3", quantity: 1 }], note: "Kestrel Bay — bay 2" },
  };

  it("fills in to the whole entry's hash input", () => {
    const template = auditHashTemplate(entry);
    expect(fillAuditHashTemplate(template, GENESIS_HASH, 1)).toBe(
      auditHashInput({ ...entry, seq: 1, prevHash: GENESIS_HASH }),
    );
    expect(template.before.endsWith(',"prevHash":"')).toBe(true);
    expect(template.after.startsWith(',"siteId":1,')).toBe(true);
  });

  it("is not misled by the same keys inside the payload or in later string values", () => {
    const tricky = {
      ...entry,
      payload: { prevHash: "", seq: 0, nested: { prevHash: "", seq: 0 } },
      subjectId: ',"prevHash":"","seq":0',
      subjectType: '","seq":0',
    };
    const hash = "ab".repeat(32);
    expect(fillAuditHashTemplate(auditHashTemplate(tricky), hash, 42)).toBe(
      auditHashInput({ ...tricky, seq: 42, prevHash: hash }),
    );
  });

  it("holds for any entry (property)", () => {
    fc.assert(
      fc.property(
        fc.record({
          at: fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
          actorId: fc.option(fc.uuid(), { nil: null }),
          siteId: fc.option(fc.nat(), { nil: null }),
          event: fc.string(),
          subjectType: fc.option(fc.string(), { nil: null }),
          subjectId: fc.option(fc.string(), { nil: null }),
          payload: fc.jsonValue(),
        }),
        fc.stringMatching(/^[0-9a-f]{64}$/),
        fc.integer({ min: 1, max: Number.MAX_SAFE_INTEGER }),
        (e, prevHash, seq) =>
          fillAuditHashTemplate(auditHashTemplate(e), prevHash, seq) === auditHashInput({ ...e, seq, prevHash }),
      ),
      { seed: 20261202, numRuns: 500 },
    );
  });
});
