import type { Thickener } from "../catalogue";

/**
 * Thickener families for consolidation. Grouping soaps of one metal (simple, 12-hydroxy, complex) follows the
 * chart vocabulary of reference/domain.md §1.0 (common practice, no source for the grouping itself). Calcium
 * sulfonate is kept apart from the calcium soaps, and shear-stable polyurea from conventional polyurea, because
 * the charts treat them as their own classes.
 */
export const THICKENER_FAMILY: Readonly<Record<Thickener, string>> = {
  lithium: "lithium soap",
  lithium_12_hydroxy: "lithium soap",
  lithium_complex: "lithium complex",
  calcium: "calcium soap",
  calcium_12_hydroxy: "calcium soap",
  calcium_complex: "calcium complex",
  calcium_sulfonate: "calcium sulfonate",
  aluminium_complex: "aluminium complex",
  barium: "barium",
  barium_complex: "barium",
  clay: "clay",
  polyurea: "polyurea",
  polyurea_shear_stable: "polyurea, shear-stable",
  sodium: "sodium",
  ptfe: "PTFE",
  silica: "silica",
  other: "other",
};
