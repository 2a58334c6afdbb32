"use client";
import { useLayoutEffect, useRef } from "react";

/**
 * A ref that holds the value of the last committed render, for callbacks and effects that must
 * see the newest props without being re-created (pointer loops, key handlers, idle work). It is
 * written after the commit, never during render, so a render React throws away leaves it alone.
 */
export function useLatest<T>(value: T): { readonly current: T } {
  const ref = useRef(value);
  useLayoutEffect(() => {
    ref.current = value;
  }, [value]);
  return ref;
}
