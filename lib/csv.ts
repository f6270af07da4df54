/**
 * Spreadsheet-formula neutralisation for CSV exports: a text cell that begins with = + - @, a tab or a
 * carriage return gets a leading apostrophe, so a spreadsheet shows it instead of running it.
 * Source: OWASP "CSV Injection" guidance, as applied in the Symfony CVE-2021-41270 fix. Plain numbers
 * (including negative ones) are left alone so they stay numbers.
 */
export function neutraliseCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return String(value);
  if (/^[=+\-@\t\r]/.test(value) && !/^-?\d+(\.\d+)?$/.test(value)) return `'${value}`;
  return value;
}

/** Undoes `neutraliseCell` on import: a leading apostrophe before a formula character is dropped. */
export function restoreCell(value: string): string {
  return /^'[=+\-@\t\r]/.test(value) ? value.slice(1) : value;
}
