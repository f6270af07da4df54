import { baseOilVerdict } from "../compatibility";
import { nlgiGradeIndex } from "../consistency";
import { THICKENER_FAMILY } from "./thickener-family";
import type { ConsolidationProduct, ConsolidationProposal, ConsolidationSettings } from "./types";

/** Defaults: the same limits as the dilution check (our settings, common practice, no source). */
export const DEFAULT_CONSOLIDATION_SETTINGS: ConsolidationSettings = { viscosityRatioLimit: 1.5, nlgiStepLimit: 1 };

/**
 * Decides which products could replace which. Product B may replace product A when all hold:
 * the same thickener family; base oils that mix (the base-oil table says compatible); base-oil viscosities at
 * 40 °C within the ratio limit; NLGI grades within the step limit; B's temperature range covers A's (an unknown
 * limit on B when A has one fails the check); and A's food grade kept (an H1 product is replaced only by H1).
 * Returns every such ordered pair, sorted by the product that would go, then by name. A product is never
 * proposed to replace itself.
 */
export function proposeConsolidation(
  products: readonly ConsolidationProduct[],
  settings: ConsolidationSettings = DEFAULT_CONSOLIDATION_SETTINGS,
): ConsolidationProposal[] {
  const proposals: ConsolidationProposal[] = [];
  for (const a of products) {
    for (const b of products) {
      if (a.id === b.id) continue;
      const reasons = replacementReasons(a, b, settings);
      if (reasons) proposals.push({ replace: { id: a.id, name: a.name }, by: { id: b.id, name: b.name }, reasons });
    }
  }
  return proposals.sort((x, y) => x.replace.name.localeCompare(y.replace.name) || x.by.name.localeCompare(y.by.name));
}

function replacementReasons(a: ConsolidationProduct, b: ConsolidationProduct, s: ConsolidationSettings): string[] | null {
  const family = THICKENER_FAMILY[a.thickener];
  if (family !== THICKENER_FAMILY[b.thickener] || family === "other") return null;
  if (baseOilVerdict(a.baseOilType, b.baseOilType).verdict !== "compatible") return null;
  if (!(a.viscosity40 > 0 && b.viscosity40 > 0)) return null;
  const ratio = Math.max(a.viscosity40, b.viscosity40) / Math.min(a.viscosity40, b.viscosity40);
  if (ratio > s.viscosityRatioLimit) return null;
  const steps = Math.abs(nlgiGradeIndex(a.nlgiGrade) - nlgiGradeIndex(b.nlgiGrade));
  if (steps > s.nlgiStepLimit) return null;
  const coversLow = a.minTemperatureC == null || (b.minTemperatureC != null && b.minTemperatureC <= a.minTemperatureC);
  const coversHigh = a.maxTemperatureC == null || (b.maxTemperatureC != null && b.maxTemperatureC >= a.maxTemperatureC);
  if (!coversLow || !coversHigh) return null;
  if (a.foodGrade === "H1" && b.foodGrade !== "H1") return null;
  return [
    `Same thickener family (${family}).`,
    `Base oils mix (${a.baseOilType} and ${b.baseOilType}).`,
    `Base-oil viscosities ${a.viscosity40} and ${b.viscosity40} mm²/s at 40 °C (ratio ${ratio.toFixed(2)}).`,
    `NLGI ${a.nlgiGrade} and ${b.nlgiGrade}.`,
    `Temperature range ${range(b)} covers ${range(a)}.`,
    a.foodGrade === "H1" ? "Food grade H1 kept." : `Food grade: ${b.foodGrade === "none" ? "not food grade" : b.foodGrade}.`,
  ];
}

const range = (p: ConsolidationProduct) => `${p.minTemperatureC ?? "?"} to ${p.maxTemperatureC ?? "?"} °C`;
