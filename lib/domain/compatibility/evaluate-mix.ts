import { additivesReason } from "./additives-reason";
import { baseOilVerdict } from "./base-oil-verdict";
import { consistencyReason, viscosityReason } from "./dilution-reasons";
import { evidenceReasons } from "./evidence-reasons";
import { foodGradeReasons } from "./food-grade-reasons";
import { DEFAULT_COMPATIBILITY_SETTINGS } from "./settings";
import { strictestVerdict } from "./strictest-verdict";
import { thickenerReason } from "./thickener-reason";
import type {
  ChartVerdict,
  CompatibilitySettings,
  GreaseProfile,
  MixContext,
  MixResult,
  Reason,
  ReasonKind,
} from "./types";

/** The findings that product-pair evidence replaces. Food grade is a regulatory gate and is never replaced. */
const OVERRIDDEN_BY_EVIDENCE: ReadonlySet<ReasonKind> = new Set([
  "thickener",
  "base_oil",
  "viscosity",
  "consistency",
  "additives",
]);

function isSameProduct(a: GreaseProfile, b: GreaseProfile): boolean {
  return (
    a.productId !== null &&
    a.productId !== undefined &&
    b.productId !== null &&
    b.productId !== undefined &&
    String(a.productId) === String(b.productId)
  );
}

/**
 * Decides whether a candidate grease may be put into a lube point that holds another grease.
 *
 * The rules, in order:
 * 1. Same product (both product ids set and equal, compared as strings): a "same_product" reason (compatible);
 *    the thickener, base-oil, dilution, additive and evidence checks are skipped and `charts` is empty. The
 *    food-grade gate still applies.
 * 2. Thickener: every enabled chart is asked; the strictest verdict among the charts that cover the pair wins, a
 *    pair none covers is "unknown" (see thickenerVerdict).
 * 3. Base oil: the miscibility table (see baseOilVerdict); "other" is unknown.
 * 4. Dilution: viscosity ratio above settings.viscosityRatioLimit, or NLGI distance above settings.nlgiStepLimit,
 *    is borderline; otherwise a compatible finding when both values are known, nothing when one is missing.
 * 5. Food grade (context.foodGradeRequired): a candidate that is not H1 is incompatible; a non-H1 grease in the
 *    bearing is borderline (flush first). Never overridden by evidence. This is the one check that is not
 *    symmetric in the two greases.
 * 6. Solid additives: different sets are borderline, the same non-empty set a compatible note; solids never
 *    upgrade a verdict.
 * 7. Evidence: records in context.evidence for exactly these two product ids (either order) each add an
 *    "evidence" reason and mark the thickener, base-oil, viscosity, consistency and additive reasons
 *    `overridden: true`. The verdict is then the strictest of the evidence and the food-grade reasons, so
 *    evidence can both upgrade (a chart's incompatible, a lab test's compatible) and downgrade.
 * 8. Verdict = strictest of the reasons not overridden (compatible < borderline < unknown < incompatible);
 *    mixingAllowed only when it is "compatible".
 *
 * Apart from the food-grade gate the result is symmetric: swapping the two greases gives the same verdict and
 * the same reason kinds and verdicts (only the order of names in messages changes). Enabling one more chart
 * never relaxes a pair that some enabled chart already covered.
 *
 * @param inBearing the grease in the point now.
 * @param candidate the grease to be added.
 * @param context the point's food-grade requirement and the recorded product-pair evidence.
 * @param settings enabled charts and dilution limits; DEFAULT_COMPATIBILITY_SETTINGS when omitted.
 * @returns the verdict, whether mixing is allowed, every reason with its source, and each enabled chart's answer
 *   for the thickener pair (null = not covered).
 */
export function evaluateMix(
  inBearing: GreaseProfile,
  candidate: GreaseProfile,
  context: MixContext = {},
  settings: CompatibilitySettings = DEFAULT_COMPATIBILITY_SETTINGS,
): MixResult {
  const reasons: Reason[] = [];
  let charts: ChartVerdict[] = [];
  const same = isSameProduct(inBearing, candidate);

  if (same) {
    reasons.push({
      kind: "same_product",
      verdict: "compatible",
      message: `The grease to be added is the same product as the grease in the bearing${inBearing.name ? ` (${inBearing.name})` : ""}.`,
    });
  } else {
    const thickener = thickenerReason(inBearing.thickener, candidate.thickener, settings.enabledCharts);
    charts = thickener.charts;
    reasons.push(thickener.reason);
    reasons.push(baseOilVerdict(inBearing.baseOilType, candidate.baseOilType));
    const optional = [
      viscosityReason(inBearing.viscosity40, candidate.viscosity40, settings.viscosityRatioLimit),
      consistencyReason(inBearing.nlgiGrade, candidate.nlgiGrade, settings.nlgiStepLimit),
      additivesReason(inBearing.solidAdditives, candidate.solidAdditives),
    ];
    for (const r of optional) if (r) reasons.push(r);
  }

  reasons.push(...foodGradeReasons(inBearing, candidate, context.foodGradeRequired === true));

  if (!same) {
    const evidence = evidenceReasons(inBearing.productId, candidate.productId, context.evidence ?? []);
    if (evidence.length > 0) {
      for (const r of reasons) if (OVERRIDDEN_BY_EVIDENCE.has(r.kind)) r.overridden = true;
      reasons.push(...evidence);
    }
  }

  const verdict = strictestVerdict(reasons.filter((r) => !r.overridden).map((r) => r.verdict));
  return { verdict, mixingAllowed: verdict === "compatible", reasons, charts };
}
