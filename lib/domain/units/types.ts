/** Which unit system a screen shows: SI units (mm, g, °C) or US customary units (in, oz, °F). */
export type UnitSystem = "metric" | "imperial";

/** The unit systems, metric first. */
export const UNIT_SYSTEMS: readonly UnitSystem[] = ["metric", "imperial"];
