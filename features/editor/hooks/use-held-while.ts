"use client";
import { useRef } from "react";

/**
 * `value` as it was when `hold` became true, for as long as `hold` stays true; `value` itself
 * otherwise. The Layout desk holds the Readout and the joint data sections this way while a
 * bolt is dragged, so memoised components see unchanged props and skip their render.
 */
export function useHeldWhile<T>(value: T, hold: boolean): T {
  const held = useRef(value);
  if (!hold) held.current = value;
  return held.current;
}
