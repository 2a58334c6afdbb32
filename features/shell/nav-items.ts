import type { Role } from "@/db/tables/core";

// The workspace navigation. Every area of the product is listed here once, so features never
// edit each other's layouts; `roles` hides an item from members who cannot use it (the server
// enforces the same rule where the data is read).
export interface NavItem {
  href: string;
  label: string;
  roles?: Role[];
}

export const NAV_ITEMS: readonly NavItem[] = [
  { href: "/desk", label: "Desk" },
  { href: "/designs", label: "Joint register" },
  { href: "/library/gaskets", label: "Stockroom" },
  { href: "/team", label: "Crew", roles: ["admin"] },
];
