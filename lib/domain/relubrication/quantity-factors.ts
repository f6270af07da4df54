import { GRAMS_PER_OUNCE, MM_PER_INCH } from "../units/constants";
import { SOURCE_SKF_QUANTITY, SOURCE_TRIBOLOGY_HANDBOOK } from "./sources";
import type { ReplenishmentSide } from "./types";

/** The factor of G = factor·D·B and its source. */
export interface QuantityFactor {
  factor: number;
  formula: string;
  source: string;
}

/**
 * Grams of grease per relubrication per mm² of D·B (domain.md §6.5).
 * - side: Gp = 0.005·D·B — SKF Rolling bearings catalogue p. 115; The Tribology Handbook §A20 (same page as
 *   Table 20.4); also an older SKF grease introduction and a plant relubrication standard.
 * - centre (through an annular groove and lubrication holes in the inner or outer ring): Gp = 0.002·D·B — SKF
 *   Rolling bearings catalogue p. 115.
 * Beware the misprint "0.0005·D·B" in one marine article (domain.md §6.5): ten times too small.
 */
export const METRIC_QUANTITY_FACTORS: Readonly<Record<ReplenishmentSide, QuantityFactor>> = {
  side: {
    factor: 0.005,
    formula: "G = 0.005·D·B",
    source: `${SOURCE_SKF_QUANTITY}; ${SOURCE_TRIBOLOGY_HANDBOOK}`,
  },
  centre: { factor: 0.002, formula: "G = 0.002·D·B", source: SOURCE_SKF_QUANTITY },
};

/** 0.002 g/mm² in oz/in²: 0.002 × 25.4² / 28.349523125 = 0.045515… Derived from the metric formula. */
const CENTRE_OUNCES_PER_SQUARE_INCH = (0.002 * MM_PER_INCH * MM_PER_INCH) / GRAMS_PER_OUNCE;

/**
 * Ounces of grease per relubrication per in² of D·B.
 * - side: G = 0.114·D·B (D, B in inches) — Machinery Lubrication, B. Fitch, "How to Calculate Grease Quantity
 *   and Frequency for Bearings" (ML #31524), as in domain.md §6.5. It is the metric 0.005 g/mm² rounded:
 *   0.005 × 645.16 / 28.349523125 = 0.11379 oz/in², so it gives about 0.2 % more than the metric form.
 * - centre: no published imperial form was seen; derived from 0.002·D·B (= 0.045515 oz/in², not rounded).
 */
export const IMPERIAL_QUANTITY_FACTORS: Readonly<Record<ReplenishmentSide, QuantityFactor>> = {
  side: {
    factor: 0.114,
    formula: "G = 0.114·D·B",
    source:
      "Machinery Lubrication, B. Fitch, 'How to Calculate Grease Quantity and Frequency for Bearings' (ML #31524)",
  },
  centre: {
    factor: CENTRE_OUNCES_PER_SQUARE_INCH,
    formula: "G = 0.0455·D·B",
    source: `derived from the metric G = 0.002·D·B (${SOURCE_SKF_QUANTITY}); no published imperial form seen`,
  },
};
