/** The aria-live line under a form: the action's failure message, or a success note. */
export function FormStatus({
  state,
  success,
}: {
  state: { ok: boolean; message?: string } | null | undefined;
  success?: string;
}) {
  const failed = state && !state.ok;
  const text = failed ? state.message : state?.ok ? success : undefined;
  return (
    <p
      role="status"
      aria-live="polite"
      className={failed ? "min-h-5 text-table text-verdict-fail" : "min-h-5 text-table text-verdict-pass"}
    >
      {text ?? ""}
    </p>
  );
}
