import { formatNumber } from "./names";
import type {
  GreaseTestResult,
  MixtureJudgement,
  MixtureProperty,
  MixtureTestInput,
  MixtureTestSettings,
  MixtureTestVerdict,
} from "./types";

/**
 * Our defaults; the standard's precision criteria are not public — configure them.
 * - Dropping point 7 °C: the repeatability of ASTM D566 (dgaequipment.com D566 page, §11; reproducibility is
 *   13 °C). Repeatability rather than reproducibility because neat greases and mixtures are normally tested in one
 *   lab, and the smaller figure is the conservative one.
 * - Prolonged worked penetration 15 (0.1 mm): the repeatability of ASTM D217 for 100 000 strokes, from memory.
 * - Storage-stability change 7 (0.1 mm): the repeatability of ASTM D217 for 60-stroke worked penetration, from
 *   memory.
 */
export const DEFAULT_MIXTURE_TEST_SETTINGS: MixtureTestSettings = {
  droppingPointAllowanceC: 7,
  workedPenetrationAllowance: 15,
  storagePenetrationChangeAllowance: 7,
};

type Outcome = MixtureJudgement["outcome"];

const PROPERTY_WORDS: Readonly<Record<MixtureProperty, string>> = {
  dropping_point: "dropping point",
  worked_penetration: "worked penetration after 100 000 strokes",
  storage_stability: "penetration change after storage",
};

function known(value: number | null | undefined): value is number {
  return typeof value === "number" && Number.isFinite(value);
}

const n = (value: number) => formatNumber(value, 1);

function notTested(ratio: string, property: MixtureProperty, missing: string[]): MixtureJudgement {
  return {
    ratio,
    property,
    outcome: "not_tested",
    message: `${ratio}: ${PROPERTY_WORDS[property]} not judged — no value for ${missing.join(", ")}.`,
  };
}

function missingOf(
  a: number | null | undefined,
  b: number | null | undefined,
  m: number | null | undefined,
  ratio: string,
): string[] {
  return [
    ...(known(a) ? [] : ["neat grease A"]),
    ...(known(b) ? [] : ["neat grease B"]),
    ...(known(m) ? [] : [`the ${ratio} mixture`]),
  ];
}

/** Higher is better. Fail below the lower neat value minus the allowance. */
function judgeDroppingPoint(
  ratio: string,
  a: number,
  b: number,
  m: number,
  allowance: number,
): MixtureJudgement {
  const lower = Math.min(a, b);
  const higher = Math.max(a, b);
  const floor = lower - allowance;
  const limit = `at least ${n(floor)} °C (lower neat value ${n(lower)} °C minus ${n(allowance)} °C)`;
  const neat = `A ${n(a)} °C, B ${n(b)} °C`;
  let outcome: Outcome;
  let message: string;
  if (m < floor) {
    outcome = "fail";
    message = `${ratio}: dropping point ${n(m)} °C is lower than both neat greases (${neat}) by more than the ${n(allowance)} °C allowance.`;
  } else if (m >= higher - allowance) {
    outcome = "pass";
    message = `${ratio}: dropping point ${n(m)} °C is within ${n(allowance)} °C of the better neat grease (${n(higher)} °C) or above it.`;
  } else {
    outcome = "dilution";
    message = `${ratio}: dropping point ${n(m)} °C lies between the neat greases (${neat}): dilution, not incompatibility.`;
  }
  return { ratio, property: "dropping_point", outcome, message, limit };
}

/**
 * Two-sided. Softer (higher) than the softer neat grease plus the allowance fails, and so does harder (lower) than
 * the harder neat grease minus the allowance. Pass and dilution are told apart against the harder neat value
 * (less softening under prolonged working is the better shear stability); that split is informational only.
 */
function judgeWorkedPenetration(
  ratio: string,
  a: number,
  b: number,
  m: number,
  allowance: number,
): MixtureJudgement {
  const softer = Math.max(a, b);
  const harder = Math.min(a, b);
  const limit = `between ${n(harder - allowance)} and ${n(softer + allowance)} (0.1 mm)`;
  const neat = `A ${n(a)}, B ${n(b)}`;
  let outcome: Outcome;
  let message: string;
  if (m > softer + allowance) {
    outcome = "fail";
    message = `${ratio}: worked penetration after 100 000 strokes ${n(m)} is softer than both neat greases (${neat}) by more than the ${n(allowance)} allowance.`;
  } else if (m < harder - allowance) {
    outcome = "fail";
    message = `${ratio}: worked penetration after 100 000 strokes ${n(m)} is harder than both neat greases (${neat}) by more than the ${n(allowance)} allowance.`;
  } else if (m <= harder + allowance) {
    outcome = "pass";
    message = `${ratio}: worked penetration after 100 000 strokes ${n(m)} is within ${n(allowance)} of the firmer neat grease (${n(harder)}).`;
  } else {
    outcome = "dilution";
    message = `${ratio}: worked penetration after 100 000 strokes ${n(m)} lies between the neat greases (${neat}): dilution, not incompatibility.`;
  }
  return { ratio, property: "worked_penetration", outcome, message, limit };
}

/** The size of the change is judged, whatever its sign. Fail above the larger neat change plus the allowance. */
function judgeStorage(ratio: string, a: number, b: number, m: number, allowance: number): MixtureJudgement {
  const worse = Math.max(Math.abs(a), Math.abs(b));
  const better = Math.min(Math.abs(a), Math.abs(b));
  const size = Math.abs(m);
  const limit = `a change of at most ${n(worse + allowance)} (0.1 mm)`;
  const neat = `A ${n(a)}, B ${n(b)}`;
  let outcome: Outcome;
  let message: string;
  if (size > worse + allowance) {
    outcome = "fail";
    message = `${ratio}: penetration changed by ${n(m)} after storage, more than both neat greases (${neat}) plus the ${n(allowance)} allowance.`;
  } else if (size <= better + allowance) {
    outcome = "pass";
    message = `${ratio}: penetration changed by ${n(m)} after storage, within ${n(allowance)} of the steadier neat grease (${n(better)}).`;
  } else {
    outcome = "dilution";
    message = `${ratio}: penetration change after storage ${n(m)} lies between the neat greases (${neat}): dilution, not incompatibility.`;
  }
  return { ratio, property: "storage_stability", outcome, message, limit };
}

function judgeAll(
  ratio: string,
  neatA: GreaseTestResult,
  neatB: GreaseTestResult,
  mix: GreaseTestResult,
  s: MixtureTestSettings,
): MixtureJudgement[] {
  const rows: [
    MixtureProperty,
    keyof GreaseTestResult,
    (r: string, a: number, b: number, m: number, d: number) => MixtureJudgement,
    number,
  ][] = [
    ["dropping_point", "droppingPointC", judgeDroppingPoint, s.droppingPointAllowanceC],
    [
      "worked_penetration",
      "workedPenetrationProlonged",
      judgeWorkedPenetration,
      s.workedPenetrationAllowance,
    ],
    ["storage_stability", "storagePenetrationChange", judgeStorage, s.storagePenetrationChangeAllowance],
  ];
  return rows.map(([property, field, judge, allowance]) => {
    const a = neatA[field];
    const b = neatB[field];
    const m = mix[field];
    if (!known(a) || !known(b) || !known(m)) return notTested(ratio, property, missingOf(a, b, m, ratio));
    return judge(ratio, a, b, m, allowance);
  });
}

/**
 * Judges a binary mixture test in the manner of ASTM D6185 (standard practice for evaluating the compatibility
 * of binary mixtures of lubricating greases): each primary property of each mixture is compared with the two neat
 * greases, not with specification limits.
 *
 * What could be confirmed (reference/domain.md §2.4) and is implemented as such: a mixture lying between the neat
 * values is dilution, not incompatibility (NLGI glossary definition); any single failure makes the pair
 * incompatible. What could not be confirmed — the numerical criteria and whether the allowance is repeatability or
 * reproducibility — is implemented in its conservative reading and left to the settings:
 * - dropping point (°C): fails below the lower neat value minus the allowance; passes at or above the higher
 *   neat value minus the allowance; dilution in between;
 * - worked penetration after 100 000 strokes (0.1 mm): fails when softer than the softer neat grease plus the
 *   allowance, and also when harder than the harder neat grease minus the allowance (D6185's significance
 *   section says incompatible mixtures usually soften but sometimes harden; the recalled criterion names only
 *   softening, so checking both directions is the conservative reading);
 * - storage stability (change in 60-stroke penetration after storage, 0.1 mm, sign ignored): fails when the change
 *   exceeds the larger neat change plus the allowance.
 * The storage conditions (temperature, duration) are the lab's and are not checked here.
 *
 * @param input neat A, neat B and one or three mixtures (e.g. 50/50, or 10/90, 50/50, 90/10 by mass).
 * @param settings the allowances; DEFAULT_MIXTURE_TEST_SETTINGS (our defaults, not the standard's) when omitted.
 * @returns one judgement per mixture and property, in input order; a property with a value missing for neat A,
 *   neat B or the mixture is "not_tested". The verdict is "incompatible" when any judgement fails (missing values
 *   do not matter then), "compatible" only when every judgement was tested and none failed, and "unknown"
 *   otherwise — including no mixtures at all and a partly tested set with no failure.
 */
export function evaluateMixtureTest(
  input: MixtureTestInput,
  settings: MixtureTestSettings = DEFAULT_MIXTURE_TEST_SETTINGS,
): MixtureTestVerdict {
  const judgements = input.mixtures.flatMap((mixture) =>
    judgeAll(
      `${formatNumber(mixture.ratioA)}/${formatNumber(mixture.ratioB)}`,
      input.neatA,
      input.neatB,
      mixture.result,
      settings,
    ),
  );
  const verdict = judgements.some((j) => j.outcome === "fail")
    ? "incompatible"
    : judgements.length > 0 && judgements.every((j) => j.outcome !== "not_tested")
      ? "compatible"
      : "unknown";
  return { verdict, judgements };
}
