// Class names for buttons and links that look like buttons, shared by server and client components.
const base =
  "inline-flex items-center justify-center gap-2 rounded-plate px-3.5 py-2 text-body font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-50";

export const buttonStyles = {
  primary: `${base} bg-brass-500 text-ink-900 hover:bg-brass-300`,
  secondary: `${base} border border-ink-200 bg-white text-ink-800 hover:bg-ink-50`,
  quiet: `${base} text-ink-700 hover:bg-ink-100`,
  danger: `${base} border border-verdict-fail text-verdict-fail hover:bg-verdict-fail-bg`,
} as const;

// A size smaller, for dense toolbars (the Pattern bench fits one row at 1440 px with these).
const compact =
  "inline-flex items-center justify-center gap-1 rounded-plate px-2 py-1 text-table font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-50";

export const toolButtonStyles = {
  secondary: `${compact} border border-ink-200 bg-white text-ink-800 hover:bg-ink-50`,
  quiet: `${compact} text-ink-700 hover:bg-ink-100`,
} as const;
