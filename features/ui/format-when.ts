// The one way a moment is written on every page: "2026-12-02 05:30 UTC" (and a day as
// "2026-12-02"), so a page never mixes two date formats.
export function formatUtcMinute(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}
