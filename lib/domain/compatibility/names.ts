import { SOLID_ADDITIVE_LABELS, type BaseOilType, type SolidAdditive, type Thickener } from "../catalogue";

/** Thickener names as they read inside a sentence. */
export const THICKENER_NAMES: Readonly<Record<Thickener, string>> = {
  aluminium_complex: "aluminium complex",
  barium: "barium",
  barium_complex: "barium complex",
  calcium: "calcium (hydrated)",
  calcium_12_hydroxy: "calcium 12-hydroxystearate",
  calcium_complex: "calcium complex",
  calcium_sulfonate: "calcium sulfonate",
  clay: "clay",
  lithium: "lithium",
  lithium_12_hydroxy: "lithium 12-hydroxystearate",
  lithium_complex: "lithium complex",
  polyurea: "polyurea",
  polyurea_shear_stable: "shear-stable polyurea",
  sodium: "sodium",
  ptfe: "PTFE",
  silica: "silica",
  other: "unlisted (other)",
};

/** Base-oil names as they read inside a sentence. */
export const BASE_OIL_NAMES: Readonly<Record<BaseOilType, string>> = {
  mineral: "mineral",
  pao: "PAO",
  ester: "ester",
  pag: "polyglycol (PAG)",
  silicone: "silicone",
  pfpe: "PFPE",
  other: "unlisted (other)",
};

/** The text with its first letter in upper case, for the start of a sentence. */
export function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** A number for a message: at most `digits` decimals, no trailing zeros. */
export function formatNumber(value: number, digits = 2): string {
  return String(Number(value.toFixed(digits)));
}

/** A solid additive as it reads in a sentence ("graphite", "PTFE"); an unlisted value is shown as given. */
export function solidAdditiveName(additive: string): string {
  if (!Object.prototype.hasOwnProperty.call(SOLID_ADDITIVE_LABELS, additive)) return additive;
  const label = SOLID_ADDITIVE_LABELS[additive as SolidAdditive];
  // Lower-case inside a sentence ("graphite"), but keep abbreviations ("PTFE").
  return /^[A-Z][a-z]/.test(label) ? label.charAt(0).toLowerCase() + label.slice(1) : label;
}

/** "a", "a and b", "a, b and c". */
export function listInWords(items: readonly string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}
