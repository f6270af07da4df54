import { parse } from "csv-parse/sync";
import { stringify } from "csv-stringify/sync";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { csvRecord } from "@/lib/csv";

describe("csvRecord (RFC 4180)", () => {
  it("quotes only fields with a comma, quote, CR or LF, doubles quotes, and ends with CRLF", () => {
    expect(csvRecord(["a", "b c", ""])).toBe("a,b c,\r\n");
    expect(csvRecord(['say "hi"', "x,y", "one\ntwo", "cr\r"])).toBe(
      '"say ""hi""","x,y","one\ntwo","cr\r"\r\n',
    );
  });

  it("round-trips any text through csv-parse", () => {
    fc.assert(
      fc.property(
        fc.array(fc.array(fc.string({ unit: "grapheme" }), { minLength: 1, maxLength: 6 }), {
          minLength: 1,
          maxLength: 5,
        }),
        (rows) => {
          const text = rows.map(csvRecord).join("");
          const parsed = parse(text, { relax_column_count: true, record_delimiter: "\r\n" }) as string[][];
          expect(parsed).toEqual(rows);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("writes the same bytes as csv-stringify for the same records", () => {
    fc.assert(
      fc.property(fc.array(fc.string({ unit: "grapheme" }), { minLength: 2, maxLength: 6 }), (row) => {
        expect(csvRecord(row)).toBe(stringify([row], { record_delimiter: "windows" }));
      }),
      { numRuns: 300 },
    );
  });
});
