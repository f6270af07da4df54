import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { addMonthsUtc, expiryDate } from "@/lib/domain/inventory";

const d = (iso: string) => new Date(iso);

describe("addMonthsUtc (calendar months, day clamped to the end of the month)", () => {
  it.each([
    { from: "2024-01-31T00:00:00.000Z", months: 1, to: "2024-02-29T00:00:00.000Z", source: "hand-worked: 2024 is a leap year" },
    { from: "2025-01-31T00:00:00.000Z", months: 1, to: "2025-02-28T00:00:00.000Z", source: "hand-worked: 2025 is not" },
    { from: "2024-02-29T00:00:00.000Z", months: 12, to: "2025-02-28T00:00:00.000Z", source: "hand-worked: no 29 Feb 2025" },
    { from: "2024-02-29T00:00:00.000Z", months: 48, to: "2028-02-29T00:00:00.000Z", source: "hand-worked: 2028 is a leap year" },
    { from: "2025-03-31T00:00:00.000Z", months: 1, to: "2025-04-30T00:00:00.000Z", source: "hand-worked: April has 30 days" },
    { from: "2025-11-30T00:00:00.000Z", months: 3, to: "2026-02-28T00:00:00.000Z", source: "hand-worked: across the year end" },
    { from: "2025-01-15T00:00:00.000Z", months: 60, to: "2030-01-15T00:00:00.000Z", source: "hand-worked: 5 years" },
    { from: "2025-08-31T00:00:00.000Z", months: -6, to: "2025-02-28T00:00:00.000Z", source: "hand-worked: backwards" },
    { from: "2025-01-31T13:45:00.000Z", months: 1, to: "2025-02-28T13:45:00.000Z", source: "keeps the UTC time of day" },
    { from: "2025-01-31T00:00:00.000Z", months: 0, to: "2025-01-31T00:00:00.000Z", source: "no months, same date" },
  ])("$from + $months months → $to ($source)", ({ from, months, to }) => {
    expect(addMonthsUtc(d(from), months).toISOString()).toBe(to);
  });

  it("an invalid date or a fractional month gives an invalid date, not a wrong one", () => {
    expect(Number.isNaN(addMonthsUtc(d("nope"), 1).getTime())).toBe(true);
    expect(Number.isNaN(addMonthsUtc(d("2025-01-01T00:00:00Z"), 1.5).getTime())).toBe(true);
  });

  it("lands in the right month, on the same day or the month's last day (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: Date.UTC(1990, 0, 1), max: Date.UTC(2090, 0, 1) }),
        fc.integer({ min: -240, max: 240 }),
        (t, months) => {
          const from = new Date(t);
          const to = addMonthsUtc(from, months);
          const monthIndex = (x: Date) => x.getUTCFullYear() * 12 + x.getUTCMonth();
          expect(monthIndex(to) - monthIndex(from)).toBe(months);
          const lastDay = new Date(Date.UTC(to.getUTCFullYear(), to.getUTCMonth() + 1, 0)).getUTCDate();
          expect(to.getUTCDate()).toBe(Math.min(from.getUTCDate(), lastDay));
          expect(to.getTime() % 86_400_000).toBe(from.getTime() % 86_400_000);
        },
      ),
    );
  });
});

describe("expiryDate (label, then manufacture + shelf life, then receipt + shelf life)", () => {
  const RECEIVED = d("2025-03-10T00:00:00Z");
  it.each([
    {
      name: "the label's date wins over manufacture + shelf life",
      input: { labelExpiresOn: d("2026-06-30T00:00:00Z"), manufacturedOn: d("2024-01-31T00:00:00Z"), shelfLifeMonths: 60 },
      expiresOn: "2026-06-30T00:00:00.000Z",
      source: "label",
      warnings: 0,
    },
    {
      name: "the label alone is enough",
      input: { labelExpiresOn: d("2026-06-30T00:00:00Z"), manufacturedOn: null, shelfLifeMonths: null },
      expiresOn: "2026-06-30T00:00:00.000Z",
      source: "label",
      warnings: 0,
    },
    {
      name: "lithium grease, 5 years from manufacture (domain.md §10.1, blp-international)",
      // hand-worked: 2023-03-15 + 60 months = 2028-03-15
      input: { labelExpiresOn: null, manufacturedOn: d("2023-03-15T00:00:00Z"), shelfLifeMonths: 60 },
      expiresOn: "2028-03-15T00:00:00.000Z",
      source: "shelf_life_from_manufacture",
      warnings: 0,
    },
    {
      name: "polyurea grease, 2 years from manufacture, from 29 Feb (domain.md §10.1, blp-international)",
      // hand-worked: 2024-02-29 + 24 months → 2026-02-29 does not exist → 2026-02-28
      input: { labelExpiresOn: null, manufacturedOn: d("2024-02-29T00:00:00Z"), shelfLifeMonths: 24 },
      expiresOn: "2026-02-28T00:00:00.000Z",
      source: "shelf_life_from_manufacture",
      warnings: 0,
    },
    {
      name: "manufactured 31 Jan with a 1-month shelf life: clamped to the end of February",
      // hand-worked: 2024 is a leap year → 29 Feb
      input: { labelExpiresOn: null, manufacturedOn: d("2024-01-31T00:00:00Z"), shelfLifeMonths: 1 },
      expiresOn: "2024-02-29T00:00:00.000Z",
      source: "shelf_life_from_manufacture",
      warnings: 0,
    },
    {
      name: "no label, no manufacture date: from receipt, with a warning that this is too late",
      // hand-worked: 2025-03-10 + 24 months = 2027-03-10
      input: { labelExpiresOn: null, manufacturedOn: null, shelfLifeMonths: 24 },
      expiresOn: "2027-03-10T00:00:00.000Z",
      source: "shelf_life_from_receipt",
      warnings: 1,
    },
    {
      name: "an invalid label date is ignored",
      // hand-worked: 2023-03-15 + 60 months = 2028-03-15
      input: { labelExpiresOn: d("not a date"), manufacturedOn: d("2023-03-15T00:00:00Z"), shelfLifeMonths: 60 },
      expiresOn: "2028-03-15T00:00:00.000Z",
      source: "shelf_life_from_manufacture",
      warnings: 0,
    },
    {
      name: "an invalid manufacture date falls back to receipt",
      input: { labelExpiresOn: null, manufacturedOn: d("not a date"), shelfLifeMonths: 24 },
      expiresOn: "2027-03-10T00:00:00.000Z",
      source: "shelf_life_from_receipt",
      warnings: 1,
    },
    {
      name: "a manufacture date without a shelf life says nothing about expiry",
      input: { labelExpiresOn: null, manufacturedOn: d("2023-03-15T00:00:00Z"), shelfLifeMonths: null },
      expiresOn: null,
      source: "unknown",
      warnings: 1,
    },
    {
      name: "a shelf life of 0 months is not used",
      input: { labelExpiresOn: null, manufacturedOn: d("2023-03-15T00:00:00Z"), shelfLifeMonths: 0 },
      expiresOn: null,
      source: "unknown",
      warnings: 2,
    },
    {
      name: "an unknown shelf life is not used",
      input: { labelExpiresOn: null, manufacturedOn: d("2023-03-15T00:00:00Z"), shelfLifeMonths: Number.NaN },
      expiresOn: null,
      source: "unknown",
      warnings: 2,
    },
    {
      name: "a fractional shelf life is rounded down to whole months (the earlier date), with a warning",
      // hand-worked: 24.5 → 24; 2023-03-15 + 24 months = 2025-03-15
      input: { labelExpiresOn: null, manufacturedOn: d("2023-03-15T00:00:00Z"), shelfLifeMonths: 24.5 },
      expiresOn: "2025-03-15T00:00:00.000Z",
      source: "shelf_life_from_manufacture",
      warnings: 1,
    },
  ])("$name → $source", ({ input, expiresOn, source, warnings }) => {
    const result = expiryDate({ ...input, receivedOn: RECEIVED });
    expect(result.source).toBe(source);
    expect(result.expiresOn?.toISOString() ?? null).toBe(expiresOn);
    expect(result.warnings).toHaveLength(warnings);
  });

  it("the receipt-based warning says the date is later than the truth", () => {
    const { warnings } = expiryDate({ labelExpiresOn: null, manufacturedOn: null, shelfLifeMonths: 24, receivedOn: RECEIVED });
    expect(warnings[0]).toMatch(/later than the true expiry/);
  });

  it("the returned date is a copy: changing it does not change the lot's label date", () => {
    const label = d("2026-06-30T00:00:00Z");
    const result = expiryDate({ labelExpiresOn: label, manufacturedOn: null, shelfLifeMonths: null, receivedOn: RECEIVED });
    result.expiresOn?.setUTCFullYear(2000);
    expect(label.toISOString()).toBe("2026-06-30T00:00:00.000Z");
  });
});
