/** The catalogue's vocabularies, exactly as in the public API (../shared/design/API.md). */

export const THICKENERS = [
  "aluminium_complex",
  "barium",
  "barium_complex",
  "calcium",
  "calcium_12_hydroxy",
  "calcium_complex",
  "calcium_sulfonate",
  "clay",
  "lithium",
  "lithium_12_hydroxy",
  "lithium_complex",
  "polyurea",
  "polyurea_shear_stable",
  "sodium",
  "ptfe",
  "silica",
  "other",
] as const;
export type Thickener = (typeof THICKENERS)[number];

export const THICKENER_LABELS: Record<Thickener, string> = {
  aluminium_complex: "Aluminium complex",
  barium: "Barium",
  barium_complex: "Barium complex",
  calcium: "Calcium (hydrated)",
  calcium_12_hydroxy: "Calcium 12-hydroxystearate",
  calcium_complex: "Calcium complex",
  calcium_sulfonate: "Calcium sulfonate",
  clay: "Clay (organo-clay, bentonite)",
  lithium: "Lithium",
  lithium_12_hydroxy: "Lithium 12-hydroxystearate",
  lithium_complex: "Lithium complex",
  polyurea: "Polyurea",
  polyurea_shear_stable: "Polyurea, shear-stable",
  sodium: "Sodium",
  ptfe: "PTFE",
  silica: "Silica",
  other: "Other",
};

export const BASE_OIL_TYPES = ["mineral", "pao", "ester", "pag", "silicone", "pfpe", "other"] as const;
export type BaseOilType = (typeof BASE_OIL_TYPES)[number];

export const BASE_OIL_LABELS: Record<BaseOilType, string> = {
  mineral: "Mineral",
  pao: "Polyalphaolefin (PAO)",
  ester: "Ester",
  pag: "Polyglycol (PAG)",
  silicone: "Silicone",
  pfpe: "Perfluoropolyether (PFPE)",
  other: "Other",
};

export const NLGI_GRADES = ["000", "00", "0", "1", "1.5", "2", "2.5", "3", "4", "5", "6"] as const;
export type NlgiGrade = (typeof NLGI_GRADES)[number];

export const FOOD_GRADES = ["H1", "H2", "H3", "none"] as const;
export type FoodGrade = (typeof FOOD_GRADES)[number];

export const FOOD_GRADE_LABELS: Record<FoodGrade, string> = {
  H1: "H1 — incidental food contact",
  H2: "H2 — no food contact",
  H3: "H3 — soluble oil",
  none: "Not food grade",
};

export const SOLID_ADDITIVES = ["molybdenum_disulfide", "graphite", "ptfe", "other"] as const;
export type SolidAdditive = (typeof SOLID_ADDITIVES)[number];

export const SOLID_ADDITIVE_LABELS: Record<SolidAdditive, string> = {
  molybdenum_disulfide: "Molybdenum disulphide (MoS₂)",
  graphite: "Graphite",
  ptfe: "PTFE",
  other: "Other solid",
};

export const PACK_KINDS = ["cartridge", "tube", "pail", "keg", "drum"] as const;
export type PackKind = (typeof PACK_KINDS)[number];
