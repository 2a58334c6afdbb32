// The one result shape of every server action: expected failures (invalid input, a rule
// refusal, a stale save) are values the form shows; only bugs throw.
export type ActionResult<T = void> =
  { ok: true; data: T } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };
