import type { IconName } from "../ui/icon";

export interface NavItem {
  href: string;
  label: string;
  icon: IconName;
  /** path prefix that marks the item active */
  match: string;
  /** in the phone's bottom bar (five fit a 390 px screen); the rest are tiles on Home */
  phoneTab: boolean;
}

/** Each area adds one entry here (and a route group under app/(app)/). */
export const NAV_ITEMS: NavItem[] = [
  { href: "/", label: "Home", icon: "home", match: "/", phoneTab: true },
  { href: "/layers", label: "Layers", icon: "layers", match: "/layers", phoneTab: true },
  { href: "/plan", label: "Plan", icon: "plan", match: "/plan", phoneTab: true },
  { href: "/emulsion", label: "Emulsion", icon: "emulsion", match: "/emulsion", phoneTab: true },
  { href: "/cases", label: "Cases", icon: "cases", match: "/cases", phoneTab: true },
  { href: "/solvents", label: "Solvents", icon: "solvents", match: "/solvents", phoneTab: false },
  { href: "/desk", label: "Desk", icon: "desk", match: "/desk", phoneTab: false },
  { href: "/group", label: "Group", icon: "group", match: "/group", phoneTab: false },
];
