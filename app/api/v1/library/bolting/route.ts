import { getChoices } from "@/features/library/route-handlers";

// The organisation's bolting for pickers: built-in rows minus hidden ones, plus its own rows.
export function GET(request: Request) {
  return getChoices(request, "bolting");
}
