export type { ConsolidationProduct, ConsolidationProposal, ConsolidationSettings } from "./types";
export { THICKENER_FAMILY } from "./thickener-family";
export { DEFAULT_CONSOLIDATION_SETTINGS, proposeConsolidation } from "./propose-consolidation";
