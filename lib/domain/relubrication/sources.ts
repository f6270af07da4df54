// Citations shared by the relubrication tables, as digested in the project's reference/domain.md §6 and
// reference/charts-verified.md §4. Kept in one place so each factor in a result names its table the same way.

/** The interval formula and its bearing-type factor. */
export const SOURCE_TRIBOLOGY_HANDBOOK =
  "The Tribology Handbook, ed. M. J. Neale, section A20 'Selection of rolling bearings', Table 20.4 " +
  "'Factor k for calculation of relubrication interval' (p. 118 of the online scan); same formula and factors " +
  "at technische-antriebselemente.de 'Relubrication Intervals: Formulas & Examples' (2026, URL with trailing slash)";

/** Temperature, vertical-shaft, bore and contamination adjustments, and the 30 000 h cap. */
export const SOURCE_SKF_TABLE_2 =
  "SKF Rolling bearings catalogue, Table 2 'Relubrication interval adjustments' (p. 117 of the tpsbearing.com " +
  "online copy)";

/** The contamination factors of Table 2, which the English online copy did not show. */
export const SOURCE_SKF_TABLE_2_CONTAMINATION =
  `${SOURCE_SKF_TABLE_2}; contamination factors 1 / 0.5 / 0.2 read in the Spanish edition of the table ` +
  "('Ajuste de intervalo de relubricación', es.scribd.com document 624157700)";

/** The moisture and vibration factors (Noria-style multiplicative set). */
export const SOURCE_NORIA_FACTORS =
  "Machinery Lubrication, B. Fitch, 'How to Calculate Grease Quantity and Frequency for Bearings' (ML #31524): " +
  "factor names seen, values from memory, corroborated cell for cell by one independent secondary copy " +
  "(charts-verified.md §4.1)";

/** Bearing-type n·dm limits. */
export const SOURCE_SKF_TABLE_1 =
  "SKF Rolling bearings catalogue, Table 1 'Bearing factors and recommended limits for speed factor A' " +
  "(p. 115 of the tpsbearing.com online copy), column C/P ≥ 15";

/** Replenishment quantity, metric. */
export const SOURCE_SKF_QUANTITY =
  "SKF Rolling bearings catalogue, relubrication quantity Gp (p. 115 of the tpsbearing.com online copy)";
