"use client";
import { useState } from "react";

/**
 * `value` as it was when `hold` became true, for as long as `hold` stays true; `value` itself
 * otherwise. The Layout desk holds the Readout and the joint data sections this way while a
 * bolt is dragged, so memoised components see unchanged props and skip their render.
 */
export function useHeldWhile<T>(value: T, hold: boolean): T {
  const [held, setHeld] = useState(() => value);
  // Adjusting state during render (React re-runs this component before committing): no effect,
  // no stale frame.
  if (!hold && held !== value) setHeld(() => value);
  return hold ? held : value;
}
