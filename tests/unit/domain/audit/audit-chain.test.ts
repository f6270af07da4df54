import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GENESIS_HASH, canonicalJson, chainVerifier, type AuditEntry } from "@/lib/domain/audit";
import { auditHash, sha256Hex } from "@/lib/server/audit-hash";

describe("sha256Hex (FIPS 180-4)", () => {
  it.each([
    // FIPS 180-2, Appendix B.1 ("abc") and the empty message (both widely published test vectors).
    ["abc", "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"],
    ["", "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855"],
  ])("hashes %j", (text, hex) => {
    expect(sha256Hex(text)).toBe(hex);
  });
});

describe("canonicalJson (RFC 8785 JSON Canonicalization Scheme, for plain JSON data)", () => {
  it("writes the RFC's §3.2.2 example exactly (from memory of RFC 8785, June 2020)", () => {
    const input = JSON.parse(
      '{"numbers":[333333333.33333329,1E30,4.50,2e-3,0.000000000000000000000000001],"string":"\\u20ac$\\u000F\\u000aA\'\\u0042\\u0022\\u005c\\\\\\"\\/","literals":[null,true,false]}',
    );
    expect(canonicalJson(input)).toBe(
      '{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"}',
    );
  });

  it.each([
    [{ b: 1, a: 2 }, '{"a":2,"b":1}', "keys sorted"],
    [
      { a: undefined, b: [undefined, 1] },
      '{"b":[null,1]}',
      "undefined dropped in objects, null in arrays, as JSON does",
    ],
    [{ é: 1, z: 2, A: 3 }, '{"A":3,"z":2,"é":1}', "UTF-16 code-unit order"],
    [new Date("2026-12-02T08:00:00Z"), '"2026-12-02T08:00:00.000Z"', "dates through toJSON"],
  ] as [unknown, string, string][])("%j → %s (%s)", (value, text) => {
    expect(canonicalJson(value)).toBe(text);
  });

  it("gives the same text for the same data whatever the key order (property)", () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.jsonValue()), (object) => {
        const reversed = Object.fromEntries(Object.entries(object).reverse());
        expect(canonicalJson(reversed)).toBe(canonicalJson(object));
        expect(JSON.parse(canonicalJson(object))).toEqual(JSON.parse(JSON.stringify(object)));
      }),
    );
  });
});

function chain(n: number): { entry: AuditEntry; hash: string }[] {
  const out: { entry: AuditEntry; hash: string }[] = [];
  let prev = GENESIS_HASH;
  for (let seq = 1; seq <= n; seq++) {
    const entry: AuditEntry = {
      seq,
      at: `2026-12-02T08:00:0${seq % 10}.000Z`,
      actorId: "u1",
      siteId: 1,
      event: "stock.issued",
      subjectType: "lot",
      subjectId: String(seq),
      payload: { quantity: seq },
      prevHash: prev,
    };
    const hash = auditHash(entry);
    out.push({ entry, hash });
    prev = hash;
  }
  return out;
}

const verify = (rows: { entry: AuditEntry; hash: string }[]) => {
  const v = chainVerifier(sha256Hex);
  for (const r of rows) if (!v.add(r.entry, r.hash)) break;
  return v.result();
};

describe("chainVerifier (a linear hash chain; common practice, no source for the exact layout)", () => {
  it("accepts an intact chain and counts it", () => {
    expect(verify(chain(6))).toEqual({ ok: true, checked: 6 });
  });

  it("names the entry whose content was changed", () => {
    const rows = chain(6);
    rows[3] = { ...rows[3]!, entry: { ...rows[3]!.entry, payload: { quantity: 40 } } };
    expect(verify(rows)).toMatchObject({ ok: false, firstBrokenSeq: 4, problem: "hash" });
  });

  it("names the missing entry when one was deleted", () => {
    const rows = chain(6);
    rows.splice(2, 1);
    expect(verify(rows)).toMatchObject({ ok: false, firstBrokenSeq: 3, problem: "gap" });
  });

  it("catches an edit whose own hash was recomputed, at the next entry", () => {
    const rows = chain(6);
    const changed = { ...rows[1]!.entry, event: "stock.received" };
    rows[1] = { entry: changed, hash: auditHash(changed) };
    expect(verify(rows)).toMatchObject({ ok: false, firstBrokenSeq: 3, problem: "link" });
  });

  it("an empty chain is intact", () => {
    expect(verify([])).toEqual({ ok: true, checked: 0 });
  });
});
