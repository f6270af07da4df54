import { z } from "zod";

/** Empty strings from forms and CSV cells count as "not given". */
const blankToUndefined = (v: unknown) => (v === "" || v === null || v === undefined ? undefined : v);
const toNumber = (v: unknown) => {
  const blank = blankToUndefined(v);
  if (typeof blank === "string") {
    const n = Number(blank.trim().replace(",", "."));
    return Number.isNaN(n) ? blank : n;
  }
  return blank;
};

/** An optional number given as a number or a form string; the message names the quantity and its unit. */
export function optionalNumber(label: string, min: number, max: number, options: { int?: boolean } = {}) {
  let inner = z.number({ error: `${label} must be a number.` }).min(min, `${label} must be at least ${min}.`).max(max, `${label} must be at most ${max}.`);
  if (options.int) inner = inner.int(`${label} must be a whole number.`);
  return z.preprocess(toNumber, inner.optional());
}

export function requiredNumber(label: string, min: number, max: number, options: { int?: boolean; exclusiveMin?: boolean } = {}) {
  let inner = z.number({ error: `Enter ${label.toLowerCase()} as a number.` });
  inner = options.exclusiveMin ? inner.gt(min, `${label} must be more than ${min}.`) : inner.min(min, `${label} must be at least ${min}.`);
  inner = inner.max(max, `${label} must be at most ${max}.`);
  if (options.int) inner = inner.int(`${label} must be a whole number.`);
  return z.preprocess(toNumber, inner);
}

export function optionalText(max: number) {
  return z.preprocess(blankToUndefined, z.string().trim().max(max, `At most ${max} characters.`).optional());
}

/** For `superRefine(…, { when })`: cross-field rules run on any object, even one with bad fields. */
export const isObjectPayload = (payload: { value: unknown }) =>
  typeof payload.value === "object" && payload.value !== null && !Array.isArray(payload.value);
