import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { fefoOrder, lotsAtRisk, pickLots, type Lot } from "@/lib/domain/inventory";

const DAY = 86_400_000;
const NOW = new Date("2025-06-01T00:00:00Z");
const day = (offsetDays: number) => new Date(NOW.getTime() + offsetDays * DAY);
const lot = (lotId: number, onHandGrams: number, expiresInDays: number | null, receivedDaysAgo = 100): Lot => ({
  lotId,
  onHandGrams,
  expiresOn: expiresInDays === null ? null : day(expiresInDays),
  receivedOn: day(-receivedDaysAgo),
});

// A small store: lot 4 expired a month ago, lot 2 expires in 30 days, lot 1 in 92 days, lot 3 has no expiry date.
const STORE: Lot[] = [lot(1, 300, 92), lot(2, 200, 30), lot(3, 1000, null), lot(4, 500, -31)];

describe("pickLots (first expiring, first out; FIFO per domain.md §10.2)", () => {
  it.each([
    {
      name: "a small issue comes from the first-expiring usable lot",
      grams: 100,
      picks: [{ lotId: 2, grams: 100 }],
      shortGrams: 0,
    },
    {
      name: "empties the first lot, then the next",
      // hand-worked: 250 = 200 from lot 2 + 50 from lot 1
      grams: 250,
      picks: [
        { lotId: 2, grams: 200 },
        { lotId: 1, grams: 50 },
      ],
      shortGrams: 0,
    },
    {
      name: "the lot without an expiry date comes after the dated ones",
      // hand-worked: 600 = 200 + 300 + 100 from lot 3
      grams: 600,
      picks: [
        { lotId: 2, grams: 200 },
        { lotId: 1, grams: 300 },
        { lotId: 3, grams: 100 },
      ],
      shortGrams: 0,
    },
    {
      name: "short when the usable lots are not enough; the expired lot is not used to fill the gap",
      // hand-worked: usable 200 + 300 + 1000 = 1500 g; 2000 − 1500 = 500 g short
      grams: 2000,
      picks: [
        { lotId: 2, grams: 200 },
        { lotId: 1, grams: 300 },
        { lotId: 3, grams: 1000 },
      ],
      shortGrams: 500,
    },
    { name: "nothing asked, nothing picked", grams: 0, picks: [], shortGrams: 0 },
    { name: "a negative request picks nothing (guard)", grams: -5, picks: [], shortGrams: 0 },
    { name: "an unknown request picks nothing (guard)", grams: Number.NaN, picks: [], shortGrams: 0 },
  ])("$name", ({ grams, picks, shortGrams }) => {
    const result = pickLots(STORE, grams, NOW);
    expect(result.picks).toEqual(picks);
    expect(result.shortGrams).toBeCloseTo(shortGrams, 9);
    expect(result.skippedExpired).toEqual([4]);
  });

  it.each([
    {
      name: "same expiry: the earlier received goes first (FIFO)",
      lots: [lot(1, 100, 30, 10), lot(2, 100, 30, 20)],
      first: 2,
    },
    {
      name: "same expiry and receipt: the lower lot id goes first",
      lots: [lot(9, 100, 30, 10), lot(5, 100, 30, 10)],
      first: 5,
    },
    {
      name: "a lot expiring exactly now is still usable",
      lots: [lot(1, 100, 30), lot(2, 100, 0)],
      first: 2,
    },
    {
      name: "two lots without expiry: the earlier received goes first",
      lots: [lot(1, 100, null, 5), lot(2, 100, null, 50)],
      first: 2,
    },
    {
      name: "an empty lot is passed over",
      lots: [lot(1, 0, 10), lot(2, 100, 30)],
      first: 2,
    },
  ])("$name", ({ lots, first }) => {
    expect(pickLots(lots, 50, NOW).picks[0]?.lotId).toBe(first);
  });

  it("lists only expired lots that still hold grease, first expired first", () => {
    const lots = [lot(1, 100, -1), lot(2, 0, -50), lot(3, 100, -10), lot(4, 100, 10)];
    expect(pickLots(lots, 10, NOW).skippedExpired).toEqual([3, 1]);
  });

  it("an expired lot one millisecond past its date is skipped", () => {
    const lots: Lot[] = [{ lotId: 1, onHandGrams: 100, expiresOn: new Date(NOW.getTime() - 1), receivedOn: day(-9) }];
    expect(pickLots(lots, 10, NOW)).toEqual({ picks: [], shortGrams: 10, skippedExpired: [1] });
  });

  const anyLot: fc.Arbitrary<Lot> = fc.record({
    lotId: fc.integer({ min: 1, max: 20 }),
    onHandGrams: fc.oneof(fc.double({ min: 0, max: 5000, noNaN: true }), fc.constantFrom(0, -10, Number.NaN)),
    expiresOn: fc.option(fc.integer({ min: -400, max: 800 }).map(day), { nil: null }),
    receivedOn: fc.integer({ min: -800, max: 0 }).map(day),
  });

  it("never takes from a later-expiring lot while an earlier one has stock, never from an expired lot (property)", () => {
    fc.assert(
      fc.property(fc.array(anyLot, { maxLength: 12 }), fc.double({ min: 0, max: 20_000, noNaN: true }), (lots, grams) => {
        const { picks, shortGrams, skippedExpired } = pickLots(lots, grams, NOW);
        const order = fefoOrder(lots);
        const usable = order.filter(
          (l) => l.onHandGrams > 0 && (l.expiresOn === null || l.expiresOn.getTime() >= NOW.getTime()),
        );
        // Picks are a prefix of the usable lots in order, every pick but the last emptying its lot.
        expect(picks.length).toBeLessThanOrEqual(usable.length);
        picks.forEach((p, i) => {
          const l = usable[i]!;
          expect(p.lotId).toBe(l.lotId);
          expect(p.grams).toBeGreaterThan(0);
          expect(p.grams).toBeLessThanOrEqual(l.onHandGrams);
          if (i < picks.length - 1) expect(p.grams).toBe(l.onHandGrams);
        });
        if (shortGrams > 0) expect(picks.length).toBe(usable.length);
        const taken = picks.reduce((s, p) => s + p.grams, 0);
        // The engine drops leftovers of 1 µg or less (GRAMS_EPSILON).
        expect(Math.abs(taken + shortGrams - grams)).toBeLessThanOrEqual(1e-6);
        expect(shortGrams).toBeGreaterThanOrEqual(0);
        for (const id of skippedExpired) {
          expect(lots.some((l) => l.lotId === id && l.expiresOn !== null && l.expiresOn.getTime() < NOW.getTime())).toBe(
            true,
          );
        }
        // Independent of fefoOrder: no pick from a lot expiring later than a usable lot left with stock.
        const expiry = (l: Lot) => l.expiresOn?.getTime() ?? Number.POSITIVE_INFINITY;
        const takenFrom = new Map<Lot, number>();
        picks.forEach((p, i) => takenFrom.set(usable[i]!, p.grams));
        for (const left of usable.filter((l) => (takenFrom.get(l) ?? 0) < l.onHandGrams)) {
          for (const pickedLot of takenFrom.keys()) expect(expiry(pickedLot)).toBeLessThanOrEqual(expiry(left));
        }
      }),
    );
  });

  it("does not reorder or change the lots it was given", () => {
    const lots = STORE.map((l) => ({ ...l }));
    pickLots(lots, 600, NOW);
    expect(lots).toEqual(STORE);
  });
});

describe("lotsAtRisk (FEFO consumption at the forecast demand; what is left on the expiry date)", () => {
  it.each([
    {
      name: "a lot expiring in 2 weeks holding 10 weeks of stock: most of it is at risk",
      // hand-worked: 1000 g at 100 g/week = 10 weeks; 2 weeks use 200 g; 1000 − 200 = 800 g at risk
      lots: [lot(1, 1000, 14)],
      perWeek: 100,
      risk: [{ lotId: 1, gramsAtRisk: 800 }],
    },
    {
      name: "a lot used up before it expires is not at risk",
      // hand-worked: 100 g at 100 g/week lasts 1 week < 4 weeks
      lots: [lot(1, 100, 28)],
      perWeek: 100,
      risk: [],
    },
    {
      name: "used up exactly on its expiry date: not at risk",
      // hand-worked: 300 g at 100 g/week = 3 weeks = 21 days
      lots: [lot(1, 300, 21)],
      perWeek: 100,
      risk: [],
    },
    {
      name: "the next lot starts when the first one expires",
      // hand-worked: lot 1 (300 g, 2 weeks): 200 used, 100 at risk; lot 2 (500 g, 6 weeks) drawn weeks 2–6: 400 used, 100 at risk
      lots: [lot(2, 500, 42), lot(1, 300, 14)],
      perWeek: 100,
      risk: [
        { lotId: 1, gramsAtRisk: 100 },
        { lotId: 2, gramsAtRisk: 100 },
      ],
    },
    {
      name: "the next lot starts when the first one is used up",
      // hand-worked: lot 1 (100 g, 4 weeks) empty after 1 week; lot 2 (500 g, 5 weeks) drawn weeks 1–5: 400 used, 100 at risk
      lots: [lot(1, 100, 28), lot(2, 500, 35)],
      perWeek: 100,
      risk: [{ lotId: 2, gramsAtRisk: 100 }],
    },
    {
      name: "an expired lot is wholly at risk and supplies nothing",
      // hand-worked: lot 9 expired: 200 g at risk; lot 1 (300 g, 3 weeks) is used up exactly on time
      lots: [lot(9, 200, -5), lot(1, 300, 21)],
      perWeek: 100,
      risk: [{ lotId: 9, gramsAtRisk: 200 }],
    },
    {
      name: "a lot without an expiry date is never at risk and does not delay the dated ones",
      // hand-worked: lot 1 (200 g, 1 week) at 100 g/week: 100 at risk; lot 3 undated
      lots: [lot(3, 10_000, null, 500), lot(1, 200, 7)],
      perWeek: 100,
      risk: [{ lotId: 1, gramsAtRisk: 100 }],
    },
    {
      name: "no demand: every dated lot is wholly at risk",
      lots: [lot(1, 200, 7), lot(2, 50, 700), lot(3, 99, null)],
      perWeek: 0,
      risk: [
        { lotId: 1, gramsAtRisk: 200 },
        { lotId: 2, gramsAtRisk: 50 },
      ],
    },
    {
      name: "unknown demand counts as none (guard)",
      lots: [lot(1, 200, 7)],
      perWeek: Number.NaN,
      risk: [{ lotId: 1, gramsAtRisk: 200 }],
    },
    {
      name: "an empty lot is not listed",
      lots: [lot(1, 0, -7)],
      perWeek: 100,
      risk: [],
    },
  ])("$name", ({ lots, perWeek, risk }) => {
    const result = lotsAtRisk(lots, perWeek, NOW);
    expect(result.map((r) => r.lotId)).toEqual(risk.map((r) => r.lotId));
    result.forEach((r, i) => {
      expect(r.gramsAtRisk).toBeCloseTo(risk[i]!.gramsAtRisk, 6);
      expect(r.expiresOn).toEqual(lots.find((l) => l.lotId === r.lotId)?.expiresOn);
    });
  });

  const datedLot: fc.Arbitrary<Lot> = fc.record({
    lotId: fc.integer({ min: 1, max: 50 }),
    onHandGrams: fc.double({ min: 0, max: 5000, noNaN: true }),
    expiresOn: fc.option(fc.integer({ min: -100, max: 400 }).map(day), { nil: null }),
    receivedOn: fc.integer({ min: -800, max: 0 }).map(day),
  });

  it("at risk is positive, at most the lot's stock, and never grows when demand grows (property)", () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(datedLot, { maxLength: 10, selector: (l) => l.lotId }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        (lots, perWeek, extra) => {
          const risk = lotsAtRisk(lots, perWeek, NOW);
          for (const r of risk) {
            const l = lots.find((x) => x.lotId === r.lotId);
            expect(l?.expiresOn).toEqual(r.expiresOn);
            expect(r.gramsAtRisk).toBeGreaterThan(0);
            expect(r.gramsAtRisk).toBeLessThanOrEqual(l!.onHandGrams);
          }
          const total = (rs: { gramsAtRisk: number }[]) => rs.reduce((s, r) => s + r.gramsAtRisk, 0);
          expect(total(lotsAtRisk(lots, perWeek + extra, NOW))).toBeLessThanOrEqual(total(risk) + 1e-6);
        },
      ),
    );
  });
});
