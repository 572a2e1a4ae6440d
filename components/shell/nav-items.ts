import type { IconName } from "../ui/icon";

export interface NavItem {
  href: string;
  label: string;
  icon: IconName;
  /** path prefix that marks the item active */
  match: string;
}

/** Each area adds one entry here (and a route group under app/(app)/). */
export const NAV_ITEMS: NavItem[] = [
  { href: "/", label: "Home", icon: "home", match: "/" },
  { href: "/layers", label: "Layers", icon: "layers", match: "/layers" },
  { href: "/plan", label: "Plan", icon: "plan", match: "/plan" },
  { href: "/emulsion", label: "Emulsion", icon: "emulsion", match: "/emulsion" },
  { href: "/group", label: "Group", icon: "group", match: "/group" },
  { href: "/cases", label: "Cases", icon: "cases", match: "/cases" },
  { href: "/solvents", label: "Solvents", icon: "solvents", match: "/solvents" },
  { href: "/desk", label: "Desk", icon: "desk", match: "/desk" },
];
