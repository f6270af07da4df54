export type { IsoVgGrade } from "./iso-vg";
export { ISO_VG_GRADES, isoViscosityGrade, viscosityMatchesIsoVg } from "./iso-vg";
export type {
  CalcStep,
  RatedViscosityInput,
  ViscosityAtTemperatureInput,
  ViscosityIndexInput,
  ViscosityIndexResult,
  ViscosityRatioInput,
  ViscosityRatioResult,
  ViscosityResult,
} from "./types";
export { VISCOSITY_TEMPERATURE_METHOD, viscosityAtTemperature } from "./viscosity-at-temperature";
export { RATED_VISCOSITY_BRANCHES, RATED_VISCOSITY_METHOD, ratedViscosity } from "./rated-viscosity";
export { viscosityRatio } from "./viscosity-ratio";
export { D2270_HIGH_VISCOSITY_FORMULAS, VISCOSITY_INDEX_METHOD, viscosityIndex } from "./viscosity-index";
