// The client side of our JSON routes: GET without the browser cache, and on an error status the
// route's own message (`{ error: { message } }`, server/auth/guard.ts jsonError) as the Error,
// else `fallback` (given the status). Used as an SWR fetcher.
export async function fetchJson<T>(url: string, fallback: string | ((status: number) => string)): Promise<T> {
  const res = await fetch(url, { cache: "no-store" });
  if (!res.ok) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new Error(
      body?.error?.message ?? (typeof fallback === "function" ? fallback(res.status) : fallback),
    );
  }
  return res.json() as Promise<T>;
}
