import "server-only";
import { AsyncLocalStorage } from "node:async_hooks";

/**
 * What the session check already read for the current request (the caller's site ids), so the queries of the
 * same request need not read it again. Lives only for one request: nothing here outlives it or crosses users.
 */
interface RequestContext {
  userId: string;
  siteIds: readonly number[];
}

// One store per process, even when a production build holds several copies of this module (one per route bundle).
const holder = globalThis as { __greaseledgerRequestContext?: AsyncLocalStorage<RequestContext> };
const storage = (holder.__greaseledgerRequestContext ??= new AsyncLocalStorage<RequestContext>());

/** Runs `fn` with the caller's site ids known to `knownSiteIds`. */
export function withRequestContext<T>(context: RequestContext, fn: () => Promise<T>): Promise<T> {
  return storage.run(context, fn);
}

/** The site ids read by this request's session check, when the request is on behalf of `userId`. */
export function knownSiteIds(userId: string): number[] | undefined {
  const context = storage.getStore();
  return context && context.userId === userId ? [...context.siteIds] : undefined;
}
