export type { IsoVgGrade } from "./iso-vg";
export { ISO_VG_GRADES, isoViscosityGrade, viscosityMatchesIsoVg } from "./iso-vg";
