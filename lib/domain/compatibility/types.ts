import type { BaseOilType, FoodGrade, NlgiGrade, Thickener } from "../catalogue";

export type Verdict = "compatible" | "borderline" | "incompatible" | "unknown";
export const VERDICTS: readonly Verdict[] = ["compatible", "borderline", "incompatible", "unknown"];

/**
 * How strict each verdict is, least strict first: compatible < borderline < unknown < incompatible. "Unknown" sits
 * above borderline because an untested pair is treated as not mixable until evidence says otherwise.
 */
export const VERDICT_STRICTNESS: Readonly<Record<Verdict, number>> = {
  compatible: 0,
  borderline: 1,
  unknown: 2,
  incompatible: 3,
};

export type ReasonKind =
  | "same_product"
  | "thickener"
  | "base_oil"
  | "viscosity"
  | "consistency"
  | "food_grade"
  | "additives"
  | "evidence";
export const REASON_KINDS: readonly ReasonKind[] = [
  "same_product",
  "thickener",
  "base_oil",
  "viscosity",
  "consistency",
  "food_grade",
  "additives",
  "evidence",
];

/** One finding behind a mixing verdict, in plain English for a technician, with the source it rests on. */
export interface Reason {
  kind: ReasonKind;
  verdict: Verdict;
  message: string;
  source?: string;
  /** True when product-pair evidence replaces this finding; it is shown but does not count towards the verdict. */
  overridden?: boolean;
}

/** e.g. "fist-2-4-table-2", "ten-type-chart", "twelve-type-chart". */
export type ChartId = string;

/** How much of a chart was read in its source: all of it, part of it, or none (recalled). */
export type Provenance = "transcribed" | "partly_transcribed" | "from_memory";

/** A published thickener compatibility chart, with the mapping from its printed labels to our thickeners. */
export interface CompatibilityChart {
  id: ChartId;
  title: string;
  /** Short name used inside messages, e.g. "FIST 2-4 Table 2". */
  shortName: string;
  /** Full citation: title, edition, table, page, where it was read. */
  source: string;
  provenance: Provenance;
  provenanceNote: string;
  /** Row and column labels as printed, in printed order. */
  labels: readonly string[];
  /** Our thickeners that the chart covers (each maps to one printed label). */
  thickeners: readonly Thickener[];
  /** The printed label a thickener is read under, or null when the chart does not cover it. */
  labelFor(thickener: Thickener): string | null;
  /**
   * The printed verdict for a pair, or null when the chart does not cover the pair (a thickener outside the
   * chart, or a diagonal the chart prints as "n/a"). Symmetric.
   */
  cell(a: Thickener, b: Thickener): Verdict | null;
  /** Whether this particular cell was read in the source or recalled; null when the pair is not covered. */
  cellProvenance(a: Thickener, b: Thickener): Provenance | null;
}

/** One chart's answer for a pair; `verdict` is null when the chart does not cover it. */
export interface ChartVerdict {
  chartId: ChartId;
  source: string;
  verdict: Verdict | null;
}

export interface CompatibilitySettings {
  /** The charts this site trusts; ids not in CHARTS are ignored. */
  enabledCharts: readonly ChartId[];
  /**
   * Ratio of the higher to the lower base-oil viscosity at 40 °C above which a mix is borderline (dilution).
   * Our setting, common practice, no source.
   */
  viscosityRatioLimit: number;
  /** Largest difference in NLGI grade steps that is still compatible. Our setting, common practice, no source. */
  nlgiStepLimit: number;
}

/** What the engine needs to know about one grease. viscosity40 is kinematic viscosity at 40 °C in mm²/s. */
export interface GreaseProfile {
  productId?: string | number | null;
  name?: string;
  thickener: Thickener;
  baseOilType: BaseOilType;
  viscosity40?: number | null;
  nlgiGrade?: NlgiGrade | null;
  foodGrade?: FoodGrade | null;
  /** SolidAdditive values ("molybdenum_disulfide", "graphite", "ptfe", "other"); other strings are shown as given. */
  solidAdditives?: readonly string[];
}

/** A document about one specific pair of products: a lab mixture test or a supplier's written statement. */
export interface PairEvidence {
  id: string | number;
  productA: string | number;
  productB: string | number;
  kind: "lab_mixture_test" | "supplier_statement";
  verdict: "compatible" | "borderline" | "incompatible";
  title: string;
  documentName?: string | null;
}

export interface MixContext {
  /** The lube point is in a food-grade area and must receive H1 grease. */
  foodGradeRequired?: boolean;
  evidence?: readonly PairEvidence[];
}

export interface MixResult {
  verdict: Verdict;
  mixingAllowed: boolean;
  reasons: Reason[];
  charts: ChartVerdict[];
}

/**
 * Allowances used when a mixture is compared with the neat greases. Our defaults; the standard's precision
 * criteria are not public — configure them.
 */
export interface MixtureTestSettings {
  /** Dropping point allowance, °C. */
  droppingPointAllowanceC: number;
  /** Worked penetration after prolonged working (100 000 strokes) allowance, 0.1 mm. */
  workedPenetrationAllowance: number;
  /** Allowance on the change in 60-stroke worked penetration after elevated-temperature storage, 0.1 mm. */
  storagePenetrationChangeAllowance: number;
}

/**
 * The three primary results of a grease or mixture. Dropping point in °C (D566 or D2265); prolonged worked
 * penetration after 100 000 strokes in 0.1 mm (D217); storage stability as the change in 60-stroke worked
 * penetration after storage in 0.1 mm (signed; its size is what is judged).
 */
export interface GreaseTestResult {
  droppingPointC?: number | null;
  workedPenetrationProlonged?: number | null;
  storagePenetrationChange?: number | null;
}

export interface MixtureTestInput {
  neatA: GreaseTestResult;
  neatB: GreaseTestResult;
  /** Mass ratios, e.g. 50/50, 10/90, 90/10 (one or three mixtures). */
  mixtures: { ratioA: number; ratioB: number; result: GreaseTestResult }[];
}

export type MixtureProperty = "dropping_point" | "worked_penetration" | "storage_stability";

export interface MixtureJudgement {
  /** e.g. "50/50" (A/B by mass). */
  ratio: string;
  property: MixtureProperty;
  outcome: "pass" | "fail" | "dilution" | "not_tested";
  message: string;
  /** The limit the mixture was held to, in words with units, when it was tested. */
  limit?: string;
}

export interface MixtureTestVerdict {
  verdict: "compatible" | "incompatible" | "unknown";
  judgements: MixtureJudgement[];
}
