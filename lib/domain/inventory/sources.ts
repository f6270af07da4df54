// Citations shared by the inventory rules, as digested in the project's reference/domain.md §10 and §11.3.

/** Take stock first in, first out, and date every batch at receipt. */
export const SOURCE_FIFO =
  "domain.md §10.2 'Inventory': FIFO, record the batch/date code at receipt, set min/max levels " +
  "(SKF 'Lubricant storage', ng.skf.com; Machinery Lubrication #31794 'Low-hanging fruit')";

/** Forecast consumption against on hand plus on order, with lead-time cover; stock kept in grams. */
export const SOURCE_REORDER_DESIGN_NOTE =
  "domain.md §10.3 design note: compare forecast consumption (planned relubrication grams per period, summed " +
  "over lube points) with on hand plus on order, with lead-time cover";

/** Shelf life runs from manufacture (the packaging date). */
export const SOURCE_SHELF_LIFE =
  "domain.md §10.1: shelf life of sealed grease in good storage, e.g. quality guaranteed 5 years from the " +
  "packaging date (SKF Maintenance Products, quoted by rockproducts.com)";
