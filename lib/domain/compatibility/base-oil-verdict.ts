import type { BaseOilType } from "../catalogue";
import { BASE_OIL_NAMES, capitalise } from "./names";
import type { Reason, Verdict } from "./types";

/** One cell of the base-oil miscibility table; the pair is unordered. */
export interface BaseOilMiscibility {
  a: BaseOilType;
  b: BaseOilType;
  verdict: Exclude<Verdict, "unknown">;
  /** Completes "<A> and <B> base oils …" in a message. */
  note: string;
  source: string;
}

// Sources, as re-checked in charts-verified.md §3.
const INNER_SU =
  'inner.su, "Tablitsy sovmestimosti smazochnykh materialov" (lubricant compatibility tables, 2025-05-05), Table 1';
const ML_28867 = 'Machinery Lubrication #28867, "Mix synthetics with mineral oils?"';
const ML_30539 = "Machinery Lubrication #30539";
const PFPE_UNVERIFIED =
  "Conservative default, unverified: no source on mixing PFPE was seen (charts-verified.md §3.3); a bearing " +
  "maker's base-oil table recalled from memory agrees";
const PFPE_SAME = "Same type; from memory (bearing maker's base-oil miscibility table, unverified)";

/**
 * Base-oil miscibility, 21 unordered pairs of the six named types. "other" is not in the table: any pair with it
 * is unknown. Built from the rules charts-verified.md §3.3 finds in two or more sources and its §7.4
 * recommendations:
 * - mineral + PAO mix (inner.su, ML #28867); mineral, PAO or ester + PAG: PAG mixes with nothing but PAG, at most
 *   "test individually" (ML #28867 and inner.su);
 * - silicone + hydrocarbons, ester or PAG do not mix (inner.su; methyl silicone for certain). inner.su does not
 *   tell methyl from phenyl silicone; a recalled bearing-maker table calls phenyl silicone miscible with mineral
 *   oil, which is unresolved, so the conservative "incompatible" stands;
 * - PFPE mixes with nothing else: conservative default, unverified.
 */
export const BASE_OIL_MISCIBILITY: readonly BaseOilMiscibility[] = [
  { a: "mineral", b: "mineral", verdict: "compatible", note: "are the same type", source: INNER_SU },
  { a: "pao", b: "pao", verdict: "compatible", note: "are the same type", source: INNER_SU },
  { a: "ester", b: "ester", verdict: "compatible", note: "are the same type", source: INNER_SU },
  { a: "pag", b: "pag", verdict: "compatible", note: "are the same type", source: INNER_SU },
  {
    a: "silicone",
    b: "silicone",
    verdict: "compatible",
    note: "are the same type (the table does not tell methyl from phenyl silicone)",
    source: INNER_SU,
  },
  { a: "pfpe", b: "pfpe", verdict: "compatible", note: "are the same type", source: PFPE_SAME },
  { a: "mineral", b: "pao", verdict: "compatible", note: "are miscible", source: `${INNER_SU}; ${ML_28867}` },
  {
    a: "mineral",
    b: "ester",
    verdict: "borderline",
    note: "are usually mixable, but one table allows only up to 10 % ester in mineral oil; test the pair",
    source: `${INNER_SU} (conditional, < 10 %); ${ML_28867}; ${ML_30539}`,
  },
  {
    a: "mineral",
    b: "pag",
    verdict: "incompatible",
    note: "do not mix: polyglycol with other oils gives sludge and tacky residue",
    source: `${INNER_SU}; ${ML_28867}`,
  },
  { a: "mineral", b: "silicone", verdict: "incompatible", note: "do not mix", source: INNER_SU },
  {
    a: "mineral",
    b: "pfpe",
    verdict: "incompatible",
    note: "do not mix (PFPE mixes with nothing else)",
    source: PFPE_UNVERIFIED,
  },
  { a: "pao", b: "ester", verdict: "compatible", note: "are miscible", source: `${INNER_SU}; ${ML_30539}` },
  {
    a: "pao",
    b: "pag",
    verdict: "incompatible",
    note: "do not mix: polyglycol with other oils gives sludge and tacky residue",
    source: `${INNER_SU}; ${ML_28867}`,
  },
  { a: "pao", b: "silicone", verdict: "incompatible", note: "do not mix", source: INNER_SU },
  {
    a: "pao",
    b: "pfpe",
    verdict: "incompatible",
    note: "do not mix (PFPE mixes with nothing else)",
    source: PFPE_UNVERIFIED,
  },
  {
    a: "ester",
    b: "pag",
    verdict: "borderline",
    note: "must be tested as a pair: one table allows only up to 5 % of one in the other, another source says polyglycol mixes with no other oil",
    source: `${INNER_SU} (conditional, < 5 %); ${ML_28867}`,
  },
  { a: "ester", b: "silicone", verdict: "incompatible", note: "do not mix", source: INNER_SU },
  {
    a: "ester",
    b: "pfpe",
    verdict: "incompatible",
    note: "do not mix (PFPE mixes with nothing else)",
    source: PFPE_UNVERIFIED,
  },
  { a: "pag", b: "silicone", verdict: "incompatible", note: "do not mix", source: INNER_SU },
  {
    a: "pag",
    b: "pfpe",
    verdict: "incompatible",
    note: "do not mix (PFPE mixes with nothing else)",
    source: PFPE_UNVERIFIED,
  },
  {
    a: "silicone",
    b: "pfpe",
    verdict: "incompatible",
    note: "do not mix (PFPE mixes with nothing else)",
    source: PFPE_UNVERIFIED,
  },
];

/**
 * Decides whether two base-oil types are miscible, from BASE_OIL_MISCIBILITY (order of the two does not matter).
 *
 * @returns the cell's verdict, the message and its source; "unknown" when either type is "other" (other + other
 *   too: two unlisted oils may be anything) or the pair is missing from the table.
 */
export function baseOilVerdict(a: BaseOilType, b: BaseOilType): Reason {
  const cell = BASE_OIL_MISCIBILITY.find((c) => (c.a === a && c.b === b) || (c.a === b && c.b === a));
  const pair =
    a === b
      ? `Both base oils are ${BASE_OIL_NAMES[a]}: they`
      : `${capitalise(BASE_OIL_NAMES[a])} and ${BASE_OIL_NAMES[b]} base oils`;
  if (!cell) {
    return {
      kind: "base_oil",
      verdict: "unknown",
      message: `${pair} are not in the miscibility table, so whether they mix is unknown. Do not mix without evidence for these two products.`,
    };
  }
  return { kind: "base_oil", verdict: cell.verdict, message: `${pair} ${cell.note}.`, source: cell.source };
}
