import { VERDICT_STRICTNESS, type Verdict } from "./types";

/**
 * Decides which of several verdicts governs: the strictest, in the order
 * compatible < borderline < unknown < incompatible.
 *
 * @returns the strictest verdict given; "unknown" for an empty list (nothing was checked, so nothing is known —
 *   fails closed).
 */
export function strictestVerdict(verdicts: readonly Verdict[]): Verdict {
  let strictest: Verdict | null = null;
  for (const v of verdicts) {
    if (strictest === null || VERDICT_STRICTNESS[v] > VERDICT_STRICTNESS[strictest]) strictest = v;
  }
  return strictest ?? "unknown";
}
