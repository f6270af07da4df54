import { SOURCE_TRIBOLOGY_HANDBOOK } from "./sources";
import type { BearingType } from "./types";

/** The bearing-type factor K of the interval formula, with the type's name as the table prints it. */
export interface BearingTypeFactor {
  k: number;
  label: string;
  source: string;
}

/**
 * Factor K of T = K·[14·10⁶/(n·√d) − 4·d] by bearing type.
 *
 * Source: The Tribology Handbook, ed. Neale, §A20, Table 20.4 (radial ball 10; cylindrical and needle roller 5;
 * spherical and tapered roller 1); the same values at technische-antriebselemente.de (k_f) and as the "bearing
 * design" factor Fd of the Noria-style set (domain.md §6.1, §6.2a).
 */
export const BEARING_TYPE_FACTORS: Readonly<Record<BearingType, BearingTypeFactor>> = {
  ball: { k: 10, label: "radial ball bearing", source: SOURCE_TRIBOLOGY_HANDBOOK },
  cylindrical_roller: { k: 5, label: "cylindrical roller bearing", source: SOURCE_TRIBOLOGY_HANDBOOK },
  needle_roller: { k: 5, label: "needle roller bearing", source: SOURCE_TRIBOLOGY_HANDBOOK },
  spherical_roller: { k: 1, label: "spherical roller bearing", source: SOURCE_TRIBOLOGY_HANDBOOK },
  tapered_roller: { k: 1, label: "tapered roller bearing", source: SOURCE_TRIBOLOGY_HANDBOOK },
};
