import * as m0001 from "./0001-foundation";
import * as m0002 from "./0002-catalogue";
import * as m0003 from "./0003-points";
import * as m0004 from "./0004-stock";
import * as m0005 from "./0005-stock-work";
import * as m0006 from "./0006-audit";
import * as m0007 from "./0007-incident-work";
import * as m0008 from "./0008-audit-head-trigger";
import * as m0009 from "./0009-audit-append-procedure";

/**
 * Every schema migration, in the order it is applied. To add one: create `NNNN-what.ts` exporting
 * `up` and `down`, and append it here. Listing them statically keeps the runner independent of how
 * TypeScript is loaded (tsx, vitest, the Next build).
 */
export const MIGRATIONS = [
  { name: "0001-foundation.ts", ...m0001 },
  { name: "0002-catalogue.ts", ...m0002 },
  { name: "0003-points.ts", ...m0003 },
  { name: "0004-stock.ts", ...m0004 },
  { name: "0005-stock-work.ts", ...m0005 },
  { name: "0006-audit.ts", ...m0006 },
  { name: "0007-incident-work.ts", ...m0007 },
  { name: "0008-audit-head-trigger.ts", ...m0008 },
  { name: "0009-audit-append-procedure.ts", ...m0009 },
];
