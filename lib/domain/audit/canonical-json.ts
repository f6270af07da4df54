/**
 * The one byte-exact text of a JSON value that the audit hash is taken over: object keys sorted by UTF-16 code
 * units, no whitespace, numbers and strings as ECMAScript's JSON.stringify writes them. For plain JSON data this is
 * the JSON Canonicalization Scheme of RFC 8785 (which builds on the same ECMAScript serialisation). Values JSON
 * cannot hold (undefined, functions, symbols) are dropped from objects and become null in arrays, as in JSON.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") {
    const text = JSON.stringify(value);
    return text === undefined ? "null" : text;
  }
  if (typeof (value as { toJSON?: unknown }).toJSON === "function")
    return canonicalJson((value as { toJSON: () => unknown }).toJSON());
  if (Array.isArray(value))
    return `[${value.map((v) => (v === undefined || typeof v === "function" || typeof v === "symbol" ? "null" : canonicalJson(v))).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined && typeof v !== "function" && typeof v !== "symbol")
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
}
