/**
 * Writes a number with at most `maxDecimals` decimals, dropping trailing zeros ("1319.93", "200", "0.5"), for
 * calculation steps and display. No thousands separators, so the text can be checked and re-typed by hand.
 * Rounds half away from zero at the last kept decimal, as `toFixed` does for values that are exact in binary;
 * never prints "-0". A value that is not finite is written "not a number" (NaN) or "∞" / "-∞".
 */
export function formatNumber(value: number, maxDecimals = 2): string {
  if (Number.isNaN(value)) return "not a number";
  if (!Number.isFinite(value)) return value > 0 ? "∞" : "-∞";
  const decimals = Math.min(Math.max(Math.trunc(maxDecimals), 0), 20);
  let text = value.toFixed(decimals);
  if (text.includes(".")) text = text.replace(/0+$/, "").replace(/\.$/, "");
  return text === "-0" ? "0" : text;
}

/** Like formatNumber, but always writes exactly `decimals` decimals ("1.00"); never "-0.00". */
export function formatFixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return formatNumber(value);
  const text = value.toFixed(Math.min(Math.max(Math.trunc(decimals), 0), 20));
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}
