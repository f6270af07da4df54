import "server-only";
import { NotFoundError } from "./errors";

/** A positive integer id from a path segment; anything else is a 404, never a 500. */
export function parseId(raw: string | undefined): number {
  if (!raw || !/^[1-9][0-9]{0,9}$/.test(raw)) throw new NotFoundError();
  const id = Number(raw);
  if (id > 4_294_967_295) throw new NotFoundError();
  return id;
}
