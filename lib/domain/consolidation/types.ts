import type { BaseOilType, FoodGrade, NlgiGrade, Thickener } from "../catalogue";

export interface ConsolidationProduct {
  id: number;
  name: string;
  thickener: Thickener;
  baseOilType: BaseOilType;
  /** Base-oil viscosity at 40 °C, mm²/s. */
  viscosity40: number;
  nlgiGrade: NlgiGrade;
  minTemperatureC?: number | null;
  maxTemperatureC?: number | null;
  foodGrade: FoodGrade;
}

export interface ConsolidationSettings {
  /** Largest ratio of the two base-oil viscosities at 40 °C still counted as overlapping. */
  viscosityRatioLimit: number;
  /** Largest NLGI step difference still counted as overlapping. */
  nlgiStepLimit: number;
}

export interface ConsolidationProposal {
  /** The product that would go. */
  replace: { id: number; name: string };
  /** The product that would take its place. */
  by: { id: number; name: string };
  /** Each condition checked, in words. */
  reasons: string[];
}
