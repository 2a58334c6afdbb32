// Words the register shows for stored codes (statuses in plain words, outline kinds, templates).
export { REVISION_STATUS_LABELS as STATUS_LABELS } from "@/features/ui/revision-status";

export const OUTLINE_LABELS: Record<string, string> = {
  circle: "Circular",
  rectangle: "Rectangular",
  obround: "Obround",
  polygon: "Polygon",
};

export const UPDATED_LABELS: Record<string, string> = {
  "1": "In the last day",
  "7": "In the last 7 days",
  "30": "In the last 30 days",
  "365": "In the last year",
};

/** "2026-12-01 14:05 UTC": the same text on the server and in every browser, whatever its zone. */
export { formatUtcMinute } from "@/features/ui/format-when";
