import { addMonthsUtc } from "./add-months-utc";
import { isValidDate, isoDay } from "./quantities";
import { SOURCE_SHELF_LIFE } from "./sources";
import type { CalcStep, ExpiryDateInput, ExpiryDateResult } from "./types";

/**
 * Decides a lot's expiry date and where it came from, most trustworthy source first:
 *
 * 1. "label": the date printed on the pack (the maker knows its product best);
 * 2. "shelf_life_from_manufacture": manufacture date + the product's shelf life (shelf life runs from
 *    manufacture, SOURCE_SHELF_LIFE);
 * 3. "shelf_life_from_receipt": receipt date + shelf life, with a warning: the grease was made before it arrived,
 *    so the true expiry is earlier by the time it spent in the supply chain;
 * 4. "unknown": no label date and no usable shelf life (expiresOn null, with a warning).
 *
 * Months are calendar months in UTC with the day clamped to the end of the month (addMonthsUtc: 31 Jan + 1 month =
 * 28/29 Feb). A shelf life that is not a number ≥ 1 is not used (warning); a fractional one is rounded down to whole
 * months (warning: the earlier date is the safe side). Invalid dates are treated as missing.
 */
export function expiryDate(input: ExpiryDateInput): ExpiryDateResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const { manufacturedOn, labelExpiresOn, receivedOn } = input;

  if (labelExpiresOn !== null && isValidDate(labelExpiresOn)) {
    steps.push({ label: "Expiry date on the label", value: isoDay(labelExpiresOn) });
    return { expiresOn: new Date(labelExpiresOn.getTime()), source: "label", steps, warnings };
  }

  let months: number | null = null;
  const shelfLife = input.shelfLifeMonths;
  if (shelfLife !== null) {
    if (typeof shelfLife === "number" && Number.isFinite(shelfLife) && shelfLife >= 1) {
      months = Math.floor(shelfLife);
      if (months !== shelfLife) {
        warnings.push(`Shelf life ${String(shelfLife)} months rounded down to ${months} whole months.`);
      }
    } else {
      warnings.push(`Shelf life ${String(shelfLife)} months is not a number of months ≥ 1: not used.`);
    }
  }

  if (months !== null) {
    if (manufacturedOn !== null && isValidDate(manufacturedOn)) {
      const expiresOn = addMonthsUtc(manufacturedOn, months);
      steps.push({
        label: "Manufacture date + shelf life",
        value: `${isoDay(manufacturedOn)} + ${months} months = ${isoDay(expiresOn)} (${SOURCE_SHELF_LIFE})`,
      });
      return { expiresOn, source: "shelf_life_from_manufacture", steps, warnings };
    }
    if (isValidDate(receivedOn)) {
      const expiresOn = addMonthsUtc(receivedOn, months);
      steps.push({
        label: "Receipt date + shelf life",
        value: `${isoDay(receivedOn)} + ${months} months = ${isoDay(expiresOn)}`,
      });
      warnings.push(
        "No label expiry or manufacture date: the expiry is counted from receipt, which is later than the true " +
          "expiry by the time the grease spent with the maker and the supplier. Record the batch date code.",
      );
      return { expiresOn, source: "shelf_life_from_receipt", steps, warnings };
    }
  }

  warnings.push("No label expiry date and no usable shelf life with a manufacture or receipt date: expiry unknown.");
  return { expiresOn: null, source: "unknown", steps, warnings };
}
