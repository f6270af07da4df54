/**
 * Lube-point tag codes: 8 characters of Crockford's base-32 alphabet (no I, L, O, U), so a code read aloud or
 * typed from a worn tag is hard to mistake. 40 bits of randomness; the random source is an argument.
 */
export const TAG_ALPHABET = "0123456789ABCDEFGHJKMNPQRSTVWXYZ";

export function tagCodeFrom(randomBytes: Uint8Array): string {
  if (randomBytes.length < 8) throw new RangeError("needs 8 random bytes");
  let code = "";
  for (let i = 0; i < 8; i++) code += TAG_ALPHABET[randomBytes[i]! % 32];
  return code;
}

/** Normalises what a person typed: upper case, no spaces or dashes, and the usual misreadings (O→0, I/L→1). */
export function normaliseTagCode(typed: string): string | null {
  const cleaned = typed.toUpperCase().replace(/[\s-]/g, "").replace(/O/g, "0").replace(/[IL]/g, "1");
  return /^[0-9A-HJKMNP-TV-Z]{8}$/.test(cleaned) ? cleaned : null;
}

/** The tag code inside a scanned QR text: either the bare code or our point URL ending in /p/<code>. */
export function tagCodeFromScan(text: string): string | null {
  const match = text.trim().match(/\/p\/([0-9A-Za-z-]{8,10})\/?$/);
  return normaliseTagCode(match ? match[1]! : text.trim());
}

/** The label code inside a scanned container label: the bare code or our container URL ending in /c/<code>. */
export function containerCodeFromScan(text: string): string | null {
  const match = text.trim().match(/\/c\/([0-9A-Za-z-]{8,10})\/?$/);
  return normaliseTagCode(match ? match[1]! : text.trim());
}

/** What a scanned code is: our lube-point tag URL, our container label URL, or a bare 8-character code. */
export function scannedKind(text: string): "point" | "container" | "bare" | null {
  const t = text.trim();
  if (/\/p\/[0-9A-Za-z-]{8,10}\/?$/.test(t)) return normaliseTagCode(t.slice(t.lastIndexOf("/p/") + 3).replace(/\/$/, "")) ? "point" : null;
  if (/\/c\/[0-9A-Za-z-]{8,10}\/?$/.test(t)) return normaliseTagCode(t.slice(t.lastIndexOf("/c/") + 3).replace(/\/$/, "")) ? "container" : null;
  return normaliseTagCode(t) ? "bare" : null;
}
