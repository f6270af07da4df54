/**
 * Password rules: at least 12 characters, up to 128, no composition rules, and not one of the
 * passwords people pick first. Source: OWASP ASVS 5.0 V6.2.1 (≥8, ≥15 advised), V6.2.9 (≥64 allowed),
 * V6.2.5 (no composition rules), V6.2.4 (block common passwords). The short list below is ours and
 * illustrative; a site can extend it.
 */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 128;

const COMMON_PASSWORDS = new Set([
  "123456789012",
  "password1234",
  "qwertyuiop12",
  "passwordpassword",
  "letmein12345",
  "welcome12345",
  "changeme1234",
  "administrator",
  "greaseledger",
  "greaseledger1",
  "iloveyou1234",
  "111111111111",
  "000000000000",
  "abcdefghijkl",
  "qwertyqwerty",
]);

/** Returns the reason a password is refused, or null when it may be used. Counts Unicode code points. */
export function passwordProblem(password: string): string | null {
  const length = [...password].length;
  if (length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters.`;
  if (length > PASSWORD_MAX_LENGTH) return `Use at most ${PASSWORD_MAX_LENGTH} characters.`;
  if (COMMON_PASSWORDS.has(password.toLowerCase())) return "This password is too common; choose another.";
  return null;
}
