import type { PairEvidence, Reason } from "./types";

const KIND_WORDS: Readonly<Record<PairEvidence["kind"], string>> = {
  lab_mixture_test: "A laboratory mixture test",
  supplier_statement: "A supplier statement",
};

function sameId(x: string | number, y: string | number): boolean {
  return String(x) === String(y);
}

/**
 * Decides which recorded evidence speaks about this exact pair of products, in either order. Ids are compared as
 * strings, so 12 and "12" are the same product.
 *
 * @returns one "evidence" reason per matching record, in the order given (the overall verdict takes the strictest
 *   of them); an empty list when either product id is missing or nothing matches.
 */
export function evidenceReasons(
  productIdA: string | number | null | undefined,
  productIdB: string | number | null | undefined,
  evidence: readonly PairEvidence[],
): Reason[] {
  if (productIdA === null || productIdA === undefined || productIdB === null || productIdB === undefined)
    return [];
  return evidence
    .filter(
      (e) =>
        (sameId(e.productA, productIdA) && sameId(e.productB, productIdB)) ||
        (sameId(e.productA, productIdB) && sameId(e.productB, productIdA)),
    )
    .map((e) => ({
      kind: "evidence",
      verdict: e.verdict,
      message:
        `${KIND_WORDS[e.kind]} for these two products, "${e.title}", rates them ${e.verdict}. It takes the place of ` +
        "the chart, base-oil, dilution and additive findings.",
      source: e.documentName ? `${e.title} (${e.documentName})` : e.title,
    }));
}
