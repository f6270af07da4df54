/**
 * ISO viscosity grades (ISO VG) of industrial lubricants: kinematic viscosity at 40 °C in mm²/s (= cSt).
 *
 * Each grade is its midpoint ±10 %. The midpoints form a rounded geometric series (six steps per decade), so the
 * bands do not touch: a value between two bands belongs to no grade.
 */

/** One ISO VG band. All viscosities are kinematic, at 40 °C, in mm²/s. */
export interface IsoVgGrade {
  /** The grade number, e.g. 46 for ISO VG 46. */
  isoVg: number;
  viscosity40Midpoint: number;
  /** Lowest kinematic viscosity at 40 °C inside the grade (inclusive), mm²/s. */
  viscosity40Min: number;
  /** Highest kinematic viscosity at 40 °C inside the grade (inclusive), mm²/s. */
  viscosity40Max: number;
  /** "transcribed" when the row was read in a source; "from_memory" when it only follows the ±10 % rule. */
  provenance: "transcribed" | "from_memory";
}

/**
 * The 20 ISO VG bands, softest oil first.
 *
 * Sources: ISO 3448 (1975) table as reproduced by mitrovichlubrificanti.it and the scribd document "Viscosity
 * classification for lubricant oil" (VG 2 to VG 1500, midpoint, min, max); lubesolut.com (18 grades); ASTM D2422
 * §4 (20 grades, ±10 % of the midpoint) via its dgaequipment.com page. All as digested in the project's
 * reference/domain.md §4.
 * VG 2200 and VG 3200: from memory — consistent with the ±10 % rule and with "20 grades" in D2422, but the rows
 * themselves were not seen in a source.
 */
export const ISO_VG_GRADES: readonly IsoVgGrade[] = [
  {
    isoVg: 2,
    viscosity40Midpoint: 2.2,
    viscosity40Min: 1.98,
    viscosity40Max: 2.42,
    provenance: "transcribed",
  },
  {
    isoVg: 3,
    viscosity40Midpoint: 3.2,
    viscosity40Min: 2.88,
    viscosity40Max: 3.52,
    provenance: "transcribed",
  },
  {
    isoVg: 5,
    viscosity40Midpoint: 4.6,
    viscosity40Min: 4.14,
    viscosity40Max: 5.06,
    provenance: "transcribed",
  },
  {
    isoVg: 7,
    viscosity40Midpoint: 6.8,
    viscosity40Min: 6.12,
    viscosity40Max: 7.48,
    provenance: "transcribed",
  },
  {
    isoVg: 10,
    viscosity40Midpoint: 10,
    viscosity40Min: 9.0,
    viscosity40Max: 11.0,
    provenance: "transcribed",
  },
  {
    isoVg: 15,
    viscosity40Midpoint: 15,
    viscosity40Min: 13.5,
    viscosity40Max: 16.5,
    provenance: "transcribed",
  },
  {
    isoVg: 22,
    viscosity40Midpoint: 22,
    viscosity40Min: 19.8,
    viscosity40Max: 24.2,
    provenance: "transcribed",
  },
  {
    isoVg: 32,
    viscosity40Midpoint: 32,
    viscosity40Min: 28.8,
    viscosity40Max: 35.2,
    provenance: "transcribed",
  },
  {
    isoVg: 46,
    viscosity40Midpoint: 46,
    viscosity40Min: 41.4,
    viscosity40Max: 50.6,
    provenance: "transcribed",
  },
  {
    isoVg: 68,
    viscosity40Midpoint: 68,
    viscosity40Min: 61.2,
    viscosity40Max: 74.8,
    provenance: "transcribed",
  },
  {
    isoVg: 100,
    viscosity40Midpoint: 100,
    viscosity40Min: 90,
    viscosity40Max: 110,
    provenance: "transcribed",
  },
  {
    isoVg: 150,
    viscosity40Midpoint: 150,
    viscosity40Min: 135,
    viscosity40Max: 165,
    provenance: "transcribed",
  },
  {
    isoVg: 220,
    viscosity40Midpoint: 220,
    viscosity40Min: 198,
    viscosity40Max: 242,
    provenance: "transcribed",
  },
  {
    isoVg: 320,
    viscosity40Midpoint: 320,
    viscosity40Min: 288,
    viscosity40Max: 352,
    provenance: "transcribed",
  },
  {
    isoVg: 460,
    viscosity40Midpoint: 460,
    viscosity40Min: 414,
    viscosity40Max: 506,
    provenance: "transcribed",
  },
  {
    isoVg: 680,
    viscosity40Midpoint: 680,
    viscosity40Min: 612,
    viscosity40Max: 748,
    provenance: "transcribed",
  },
  {
    isoVg: 1000,
    viscosity40Midpoint: 1000,
    viscosity40Min: 900,
    viscosity40Max: 1100,
    provenance: "transcribed",
  },
  {
    isoVg: 1500,
    viscosity40Midpoint: 1500,
    viscosity40Min: 1350,
    viscosity40Max: 1650,
    provenance: "transcribed",
  },
  {
    isoVg: 2200,
    viscosity40Midpoint: 2200,
    viscosity40Min: 1980,
    viscosity40Max: 2420,
    provenance: "from_memory",
  },
  {
    isoVg: 3200,
    viscosity40Midpoint: 3200,
    viscosity40Min: 2880,
    viscosity40Max: 3520,
    provenance: "from_memory",
  },
];

/**
 * Decides the ISO viscosity grade of an oil from its kinematic viscosity at 40 °C.
 *
 * @param viscosity40 kinematic viscosity at 40 °C, mm²/s.
 * @returns the grade number (e.g. 46) when the value lies inside a band, limits included. Returns `null` for a
 *   value in the gap between two bands (e.g. 55 mm²/s: VG 46 ends at 50.6, VG 68 starts at 61.2), below VG 2
 *   (< 1.98) or above VG 3200 (> 3520), and for a value that is not a positive finite number. A value is never
 *   rounded into the nearest grade.
 */
export function isoViscosityGrade(viscosity40: number): number | null {
  if (!Number.isFinite(viscosity40) || viscosity40 <= 0) return null;
  const band = ISO_VG_GRADES.find((g) => viscosity40 >= g.viscosity40Min && viscosity40 <= g.viscosity40Max);
  return band ? band.isoVg : null;
}

/**
 * Decides whether a measured or declared viscosity at 40 °C lies inside a stated ISO VG (for the catalogue form's
 * warning).
 *
 * @param grade the ISO VG number, e.g. 220.
 * @param viscosity40 kinematic viscosity at 40 °C, mm²/s.
 * @returns `true` only when `grade` is one of the 20 ISO VG numbers and the value lies inside its band, limits
 *   included; `false` for an unknown grade number or a value that is not a positive finite number.
 */
export function viscosityMatchesIsoVg(grade: number, viscosity40: number): boolean {
  if (!Number.isFinite(viscosity40) || viscosity40 <= 0) return false;
  const band = ISO_VG_GRADES.find((g) => g.isoVg === grade);
  return band !== undefined && viscosity40 >= band.viscosity40Min && viscosity40 <= band.viscosity40Max;
}
