export type {
  Verdict,
  ReasonKind,
  Reason,
  ChartId,
  Provenance,
  CompatibilityChart,
  ChartVerdict,
  CompatibilitySettings,
  GreaseProfile,
  PairEvidence,
  MixContext,
  MixResult,
  MixtureTestSettings,
  GreaseTestResult,
  MixtureTestInput,
  MixtureProperty,
  MixtureJudgement,
  MixtureTestVerdict,
} from "./types";
export { VERDICTS, VERDICT_STRICTNESS, REASON_KINDS } from "./types";
export { CHARTS, DEFAULT_ENABLED_CHARTS } from "./charts";
export { DEFAULT_COMPATIBILITY_SETTINGS } from "./settings";
export { strictestVerdict } from "./strictest-verdict";
export { thickenerVerdict } from "./thickener-verdict";
export type { BaseOilMiscibility } from "./base-oil-verdict";
export { BASE_OIL_MISCIBILITY, baseOilVerdict } from "./base-oil-verdict";
export { evaluateMix } from "./evaluate-mix";
export { DEFAULT_MIXTURE_TEST_SETTINGS, evaluateMixtureTest } from "./evaluate-mixture-test";
