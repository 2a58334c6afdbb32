import "server-only";

/**
 * The Cache-Control policies of every response the app writes itself, by name; route handlers
 * and helpers use `cacheControl(policy)`, never a header literal (a test keeps it that way).
 * Pages are left to Next (every page is dynamic, see app/layout.tsx).
 */
export const CACHE_POLICIES = {
  /** An organisation's or a user's data (API JSON, downloads, job status): never stored anywhere. */
  userData: "private, no-store",
  /** No user data, but only a fresh answer is worth anything (health, metrics, auth refusals). */
  fresh: "no-store",
  /** An organisation's data that a browser may keep but must revalidate (ETag) before each use: the design reads. */
  revalidate: "private, no-cache",
  /** The same for every signed-in user of one release (the design JSON Schema): 5 minutes, browser only. */
  releaseStatic: "private, max-age=300",
} as const;

export type CachePolicy = keyof typeof CACHE_POLICIES;

/** The header for `policy`, to spread into a response's headers: `{ ...cacheControl("userData") }`. */
export function cacheControl(policy: CachePolicy): { "cache-control": string } {
  return { "cache-control": CACHE_POLICIES[policy] };
}
