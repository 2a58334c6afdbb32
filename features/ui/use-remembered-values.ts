"use client";

import { useState } from "react";

/**
 * React resets a form after its action runs. This keeps what the person typed (except the
 * fields named in `forget`, e.g. passwords) as the inputs' defaultValue, so a refused submit
 * does not wipe the form: use `values.x` as defaultValue and `remember(formAction)` as action.
 */
export function useRememberedValues(forget: string[] = []) {
  const [values, setValues] = useState<Record<string, string>>({});
  function remember(action: (formData: FormData) => void) {
    return (formData: FormData) => {
      const next: Record<string, string> = {};
      for (const [key, value] of formData.entries()) {
        if (typeof value === "string" && !forget.includes(key) && !key.startsWith("$")) next[key] = value;
      }
      setValues(next);
      action(formData);
    };
  }
  return { values, remember };
}
