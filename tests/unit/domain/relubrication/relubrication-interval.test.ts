import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  BEARING_TYPES,
  DEFAULT_INTERVAL_CAP_HOURS,
  LEVELS,
  relubricationInterval,
  type RelubricationInput,
} from "@/lib/domain/relubrication";

// The formula T = K·[14·10⁶/(n·√d) − 4·d] and K = 10 / 5 / 1: The Tribology Handbook §A20 Table 20.4 and
// technische-antriebselemente.de (domain.md §6.1). Expected values below are derived from that formula by hand.
const FORMULA = "derived from formula T = K·[14e6/(n·√d) − 4d] (Tribology Handbook §A20 Table 20.4)";
const SKF2 = "SKF Rolling bearings catalogue Table 2 (domain.md §6.3)";

/** A ball bearing, d = 100 mm at 1000 r/min: 10·(14e6/(1000·10) − 400) = 10·(1400 − 400) = 10 000 h. */
const BALL_10000: RelubricationInput = { bearingType: "ball", boreMm: 100, speedRpm: 1000 };

describe("relubricationInterval: base formula per bearing type", () => {
  it.each([
    // 10·(14e6/(1500·√50) − 4·50) = 10·(14e6/10606.60 − 200) = 10·(1319.93 − 200) = 11 199.33 h
    { bearingType: "ball", boreMm: 50, speedRpm: 1500, hours: 11199.33 },
    // 10·(14e6/(1000·√25) − 100) = 10·(2800 − 100) = 27 000 h
    { bearingType: "ball", boreMm: 25, speedRpm: 1000, hours: 27000 },
    // 5·(14e6/(1000·√60) − 240) = 5·(14e6/7745.97 − 240) = 5·(1807.39 − 240) = 7836.96 h
    { bearingType: "cylindrical_roller", boreMm: 60, speedRpm: 1000, hours: 7836.96 },
    // 5·(14e6/(2000·√30) − 120) = 5·(14e6/10954.45 − 120) = 5·(1278.02 − 120) = 5790.10 h
    { bearingType: "needle_roller", boreMm: 30, speedRpm: 2000, hours: 5790.1 },
    // 1·(14e6/(750·√100) − 400) = 1866.67 − 400 = 1466.67 h
    { bearingType: "spherical_roller", boreMm: 100, speedRpm: 750, hours: 1466.67 },
    // 1·(14e6/(3000·10) − 400) = 466.67 − 400 = 66.67 h — the example in domain.md §6.1
    { bearingType: "tapered_roller", boreMm: 100, speedRpm: 3000, hours: 66.67 },
  ] as const)(`$bearingType d=$boreMm n=$speedRpm → $hours h (${FORMULA})`, ({ hours, ...input }) => {
    const r = relubricationInterval(input);
    expect(r.intervalHours).toBeCloseTo(hours, 1);
    expect(r.warnings).toEqual([]);
    expect(r.method).toMatch(/14·10⁶\/\(n·√d\) − 4·d/);
    expect(r.steps.map((s) => s.label)).toContain("Base interval T = K·[14 000 000/(n·√d) − 4·d]");
  });

  it("shows the hand arithmetic in its steps (ball d=50 n=1500)", () => {
    const r = relubricationInterval({ bearingType: "ball", boreMm: 50, speedRpm: 1500 });
    const base = r.steps.find((s) => s.label.startsWith("Base interval"))!;
    expect(base.value).toBe("10 × (1319.93 − 200) = 11199.33 h");
    expect(r.steps.find((s) => s.label === "4·d")!.value).toBe("4 × 50 = 200");
  });

  it.each([
    { bearingType: "ball", k: 10 },
    { bearingType: "cylindrical_roller", k: 5 },
    { bearingType: "needle_roller", k: 5 },
    { bearingType: "spherical_roller", k: 1 },
    { bearingType: "tapered_roller", k: 1 },
  ] as const)(
    "$bearingType carries K = $k with its source (Tribology Handbook §A20 Table 20.4)",
    ({ bearingType, k }) => {
      const r = relubricationInterval({ bearingType, boreMm: 100, speedRpm: 1000 });
      expect(r.factors[0]).toMatchObject({ value: k, source: expect.stringContaining("Table 20.4") });
      expect(r.intervalHours).toBeCloseTo(k * 1000, 6); // K·(1400 − 400)
    },
  );
});

describe("relubricationInterval: temperature rule (SKF Table 2; continuous above 70 °C, one doubling at ≤ 55 °C)", () => {
  it.each([
    { c: 70, hours: 10000, why: "the base temperature: factor 1" },
    { c: 85, hours: 5000, why: "15 °C above: halve once, 0.5^1" },
    { c: 100, hours: 2500, why: "30 °C above: halve twice, 0.5^2" },
    { c: 115, hours: 1250, why: "45 °C above: 0.5^3" },
    {
      c: 77.5,
      hours: 7071.07,
      why: "continuous reading: 0.5^(7.5/15) = 0.70711 (our choice, domain.md §6.3 ambiguity)",
    },
    { c: 90, hours: 3968.5, why: "continuous: 0.5^(20/15) = 0.39685" },
    { c: 70.1, hours: 9953.9, why: "continuous: no two-fold jump just above 70 °C, 0.5^(0.1/15) = 0.99539" },
    { c: 55, hours: 20000, why: "exactly 15 °C below: double (once)" },
    { c: 40, hours: 20000, why: "30 °C below: still only one doubling" },
    { c: -10, hours: 20000, why: "far below: one doubling at most" },
    { c: 56, hours: 10000, why: "less than 15 °C below: no doubling (stepwise below 70 °C, our choice)" },
    { c: 69, hours: 10000, why: "just below base: no change" },
  ])(`$c °C → $hours h ($why; ${SKF2})`, ({ c, hours }) => {
    const r = relubricationInterval({ ...BALL_10000, operatingTemperatureC: c, greaseMaxTemperatureC: 150 });
    expect(r.intervalHours).toBeCloseTo(hours, 0);
    expect(r.warnings).toEqual([]);
  });

  it(`no temperature given → the 70 °C base, factor 1 (${SKF2}: diagram at 70 °C)`, () => {
    const r = relubricationInterval(BALL_10000);
    expect(r.intervalHours).toBe(10000);
    expect(r.factors.find((f) => f.name.startsWith("Temperature"))!.value).toBe(1);
  });

  it(`above the grease's upper limit: warns, still computes (${SKF2}: the rule holds up to the HTL)`, () => {
    const r = relubricationInterval({ ...BALL_10000, operatingTemperatureC: 90, greaseMaxTemperatureC: 80 });
    expect(r.intervalHours).toBeCloseTo(3968.5, 0); // 10 000 · 0.5^(20/15)
    expect(r.warnings.join(" ")).toMatch(/above the grease's upper limit \(80 °C\)/);
  });

  it("at exactly the grease's upper limit: no limit warning (boundary)", () => {
    const r = relubricationInterval({ ...BALL_10000, operatingTemperatureC: 80, greaseMaxTemperatureC: 80 });
    expect(r.warnings).toEqual([]);
  });

  it("above 70 °C with no grease limit known: asks to check the data sheet (our rule)", () => {
    const r = relubricationInterval({ ...BALL_10000, operatingTemperatureC: 85 });
    expect(r.intervalHours).toBeCloseTo(5000, 6);
    expect(r.warnings.join(" ")).toMatch(/upper temperature limit is not known/);
  });

  it("shows the temperature arithmetic", () => {
    const r = relubricationInterval({
      ...BALL_10000,
      operatingTemperatureC: 100,
      greaseMaxTemperatureC: 120,
    });
    expect(r.steps.map((s) => s.value)).toContain("0.5^((100 − 70) / 15) = 0.5^2 = 0.25");
  });
});

describe("relubricationInterval: shaft, environment and bore factors", () => {
  it.each([
    { input: { verticalShaft: true }, hours: 5000, source: `${SKF2}: vertical shaft, halve` },
    { input: { verticalShaft: false }, hours: 10000, source: `${SKF2}: horizontal is the base` },
    {
      input: { contamination: "low" },
      hours: 10000,
      source: "SKF Table 2 level 1, ×1 (charts-verified §4.3)",
    },
    {
      input: { contamination: "moderate" },
      hours: 5000,
      source: "SKF Table 2 level 2, ×0.5 (charts-verified §4.3)",
    },
    {
      input: { contamination: "high" },
      hours: 2000,
      source: "SKF Table 2 level 3, ×0.2 (charts-verified §4.3)",
    },
    {
      input: { moisture: "moderate" },
      hours: 7000,
      source: "Noria Fm RH 80–90 % ×0.7 (domain.md §6.2a, charts-verified §4.1)",
    },
    { input: { moisture: "high" }, hours: 4000, source: "Noria Fm condensation ×0.4 (charts-verified §4.1)" },
    {
      input: { moisture: "very_high" },
      hours: 1000,
      source: "Noria Fm water on housing ×0.1 (charts-verified §4.1/§7)",
    },
    {
      input: { vibration: "moderate" },
      hours: 6000,
      source: "Noria Fv 0.2–0.4 in/s ×0.6 (charts-verified §4.1)",
    },
    { input: { vibration: "high" }, hours: 3000, source: "Noria Fv > 0.4 in/s ×0.3 (charts-verified §4.1)" },
    // 10 000 · 0.5 (85 °C) · 0.5 (vertical) · 0.5 (moderate contamination) · 0.7 (moderate moisture) = 875 h
    {
      input: {
        operatingTemperatureC: 85,
        greaseMaxTemperatureC: 120,
        verticalShaft: true,
        contamination: "moderate",
        moisture: "moderate",
      },
      hours: 875,
      source: "derived: 10 000 × 0.5 × 0.5 × 0.5 × 0.7",
    },
  ] as { input: Partial<RelubricationInput>; hours: number; source: string }[])(
    "ball d=100 n=1000 with $input → $hours h ($source)",
    ({ input, hours }) => {
      const r = relubricationInterval({ ...BALL_10000, ...input });
      expect(r.intervalHours).toBeCloseTo(hours, 6);
      expect(r.warnings).toEqual([]);
    },
  );

  it("does not apply Noria's temperature or position factors on top of SKF's (no double counting)", () => {
    const r = relubricationInterval({
      ...BALL_10000,
      operatingTemperatureC: 85,
      greaseMaxTemperatureC: 120,
      verticalShaft: true,
    });
    // SKF alone: 10 000 × 0.5 × 0.5 = 2500. With Noria Ft (0.2 at 80–93 °C) and Fp (0.3 vertical) it would be 150.
    expect(r.intervalHours).toBeCloseTo(2500, 6);
  });

  it("very high contamination → null with a warning: SKF level 4 has no factor we could verify (charts-verified §4.3)", () => {
    const r = relubricationInterval({ ...BALL_10000, contamination: "very_high" });
    expect(r.intervalHours).toBeNull();
    expect(r.warnings.join(" ")).toMatch(/outside the method's range.*continuous/);
  });

  it("very high vibration uses the top band's 0.3 and warns (SKF Table 2: machine-specific reduction)", () => {
    const r = relubricationInterval({ ...BALL_10000, vibration: "very_high" });
    expect(r.intervalHours).toBeCloseTo(3000, 6);
    expect(r.warnings.join(" ")).toMatch(/machine-specific/);
  });

  it.each([
    // 1·(14e6/(200·√400) − 1600) = 3500 − 1600 = 1900 h, then × 0.5 = 950 h
    {
      boreMm: 400,
      speedRpm: 200,
      hours: 950,
      warned: true,
      source: `${SKF2}: d > 300 mm, start at half; ${FORMULA}`,
    },
    // 1·(14e6/(200·√300) − 1200) = 4041.45 − 1200 = 2841.45 h, no halving at exactly 300 mm
    { boreMm: 300, speedRpm: 200, hours: 2841.45, warned: false, source: `${SKF2}: only above 300 mm` },
  ])("spherical d=$boreMm → $hours h ($source)", ({ boreMm, speedRpm, hours, warned }) => {
    const r = relubricationInterval({ bearingType: "spherical_roller", boreMm, speedRpm });
    expect(r.intervalHours).toBeCloseTo(hours, 1);
    expect(r.warnings.some((w) => /above 300 mm/.test(w))).toBe(warned);
  });

  it("lists every factor applied with its source", () => {
    const r = relubricationInterval({
      ...BALL_10000,
      operatingTemperatureC: 85,
      greaseMaxTemperatureC: 120,
      contamination: "high",
    });
    expect(r.factors.map((f) => f.value)).toEqual([10, 0.5, 1, 0.2, 1, 1]);
    for (const f of r.factors) expect(f.source.length).toBeGreaterThan(20);
  });
});

describe("relubricationInterval: cap", () => {
  it.each([
    // 10·(14e6/(500·5) − 100) = 10·(5600 − 100) = 55 000 h → capped
    {
      options: undefined,
      hours: 30000,
      source: "SKF Table 2: no intervals above 30 000 h (charts-verified §4.4)",
    },
    {
      options: { capHours: 32000 },
      hours: 32000,
      source: "a 32 000 h plant standard (charts-verified §4.4)",
    },
    {
      options: { capHours: 20000 },
      hours: 20000,
      source: "a 20 000 h bearing-unit manual (charts-verified §4.4)",
    },
    { options: { capHours: 60000 }, hours: 55000, source: "cap above the value: not applied" },
  ])("ball d=25 n=500 (55 000 h) with $options → $hours h ($source)", ({ options, hours }) => {
    const r = relubricationInterval({ bearingType: "ball", boreMm: 25, speedRpm: 500 }, options);
    expect(r.intervalHours).toBe(hours);
    expect(r.warnings.some((w) => /cap/.test(w))).toBe(hours < 55000);
  });

  it("the default cap is 30 000 h (SKF Table 2)", () => {
    expect(DEFAULT_INTERVAL_CAP_HOURS).toBe(30000);
  });

  it("the doubling below 55 °C is capped too: 27 000 h × 2 = 54 000 → 30 000 h", () => {
    const r = relubricationInterval({
      bearingType: "ball",
      boreMm: 25,
      speedRpm: 1000,
      operatingTemperatureC: 40,
    });
    expect(r.intervalHours).toBe(30000);
  });

  it.each([0, -5, Number.NaN])(
    "an unusable capHours (%s) falls back to 30 000 h with a warning",
    (capHours) => {
      const r = relubricationInterval({ bearingType: "ball", boreMm: 25, speedRpm: 500 }, { capHours });
      expect(r.intervalHours).toBe(30000);
      expect(r.warnings.join(" ")).toMatch(/cap must be a positive number/);
    },
  );
});

describe("relubricationInterval: outside the method's range → null with a warning", () => {
  it.each([
    // 14e6/(5000·10) = 280 < 4·100 = 400 → negative bracket
    {
      input: { bearingType: "tapered_roller", boreMm: 100, speedRpm: 5000 },
      why: "negative bracket: 280 − 400 (derived)",
    },
    // 14e6/(3500·10) = 400 = 4·100 → bracket exactly 0
    {
      input: { bearingType: "ball", boreMm: 100, speedRpm: 3500 },
      why: "bracket exactly 0: 400 − 400 (derived)",
    },
    { input: { bearingType: "ball", boreMm: 50, speedRpm: 0 }, why: "zero speed" },
    { input: { bearingType: "ball", boreMm: 50, speedRpm: -1500 }, why: "negative speed" },
    { input: { bearingType: "ball", boreMm: Number.NaN, speedRpm: 1500 }, why: "NaN bore" },
    { input: { bearingType: "ball", boreMm: 50, speedRpm: Number.NaN }, why: "NaN speed" },
    { input: { bearingType: "ball", boreMm: 0, speedRpm: 1500 }, why: "zero bore" },
    {
      input: { bearingType: "ball", boreMm: Number.POSITIVE_INFINITY, speedRpm: 1500 },
      why: "infinite bore",
    },
    { input: { bearingType: "thrust_ball", boreMm: 50, speedRpm: 1500 }, why: "unknown bearing type" },
  ] as { input: RelubricationInput; why: string }[])("$why", ({ input }) => {
    const r = relubricationInterval(input);
    expect(r.intervalHours).toBeNull();
    expect(r.warnings.join(" ")).toMatch(/outside the method's range/);
  });
});

describe("relubricationInterval: speed factor check when D is known (SKF Table 1, domain.md §6.4)", () => {
  it("ball d=20 D=47 at 15 000 r/min: n·dm = 15000 × 33.5 = 502 500 > 500 000 → warning, interval still given", () => {
    // 10·(14e6/(15000·√20) − 80) = 10·(208.70 − 80) = 1287.0 h
    const r = relubricationInterval({
      bearingType: "ball",
      boreMm: 20,
      outsideDiameterMm: 47,
      speedRpm: 15000,
    });
    expect(r.intervalHours).toBeCloseTo(1287.0, 1);
    expect(r.warnings.join(" ")).toMatch(/502500 mm\/min is above the 500000 mm\/min/);
    expect(r.steps.map((s) => s.value)).toContain("15000 r/min × 33.5 mm = 502500 mm/min");
  });

  it("D not larger than d: warns that the speed check was skipped, interval still given", () => {
    const r = relubricationInterval({ ...BALL_10000, outsideDiameterMm: 90 });
    expect(r.intervalHours).toBe(10000);
    expect(r.warnings.join(" ")).toMatch(/speed factor n·dm was not checked/);
  });
});

describe("relubricationInterval: properties", () => {
  const input = fc.record({
    bearingType: fc.constantFrom(...BEARING_TYPES),
    boreMm: fc.double({ min: 1, max: 1500, noNaN: true }),
    speedRpm: fc.double({ min: 1, max: 50000, noNaN: true }),
    operatingTemperatureC: fc.option(fc.double({ min: -60, max: 250, noNaN: true }), { nil: null }),
    verticalShaft: fc.boolean(),
    contamination: fc.constantFrom(...LEVELS),
    moisture: fc.constantFrom(...LEVELS),
    vibration: fc.constantFrom(...LEVELS),
  });

  it("never returns a negative, zero, NaN or above-cap interval: a positive number ≤ 30 000 h, or null with a warning", () => {
    fc.assert(
      fc.property(input, (i) => {
        const r = relubricationInterval(i);
        if (r.intervalHours === null) expect(r.warnings.length).toBeGreaterThan(0);
        else {
          expect(Number.isFinite(r.intervalHours)).toBe(true);
          expect(r.intervalHours).toBeGreaterThan(0);
          expect(r.intervalHours).toBeLessThanOrEqual(30000);
        }
      }),
    );
  });

  it("a faster bearing never gets a longer interval, all else equal", () => {
    fc.assert(
      fc.property(input, fc.double({ min: 1.0001, max: 10, noNaN: true }), (i, ratio) => {
        const slow = relubricationInterval(i).intervalHours;
        const fast = relubricationInterval({ ...i, speedRpm: i.speedRpm * ratio }).intervalHours;
        if (slow === null) expect(fast).toBeNull();
        else if (fast !== null) expect(fast).toBeLessThanOrEqual(slow);
      }),
    );
  });

  it("a hotter bearing never gets a longer interval, all else equal", () => {
    fc.assert(
      fc.property(
        input,
        fc.double({ min: -60, max: 250, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        (i, t, dt) => {
          const cool = relubricationInterval({ ...i, operatingTemperatureC: t }).intervalHours;
          const hot = relubricationInterval({ ...i, operatingTemperatureC: t + dt }).intervalHours;
          if (cool !== null && hot !== null) expect(hot).toBeLessThanOrEqual(cool);
        },
      ),
    );
  });
});
