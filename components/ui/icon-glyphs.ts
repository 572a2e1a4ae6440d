import type { ColorRole } from "../../hooks/theme";

/** Line glyphs drawn for Phasewise on a 24 × 24 grid, shared by the native and web icons. */
export const GLYPHS = {
  home: ["M4 12 L12 5 L20 12", "M6 11 V20 H18 V11"],
  group: ["M4 20 C4 15 8 14 9 14 C10 14 14 15 14 20", "M13 19 C13 16 15 15 17 15 C19 15 21 16 21 19"],
  layers: ["M6 4 H18 L14 13 V19 L10 21 V13 Z", "M8.5 9 H15.5"],
  plan: ["M5 5 H19 V19 H5 Z", "M8 9 H16", "M8 13 H16", "M8 17 H12"],
  emulsion: ["M4 12 C7 9 9 15 12 12 C15 9 17 15 20 12", "M4 7 H20", "M4 17 H20"],
  cases: ["M6 4 H15 L19 8 V20 H6 Z", "M15 4 V8 H19", "M9 13 H16", "M9 16 H14"],
  solvents: ["M9 3 H15", "M10 3 V9 L5 19 C4.5 20 5 21 6 21 H18 C19 21 19.5 20 19 19 L14 9 V3"],
  desk: ["M3 8 H21 V18 H3 Z", "M7 8 V5 H17 V8", "M12 12 V14"],
  search: ["M15.5 15.5 L20 20"],
  camera: ["M4 8 H8 L10 5 H14 L16 8 H20 V19 H4 Z"],
  plus: ["M12 5 V19", "M5 12 H19"],
  check: ["M5 12 L10 17 L19 7"],
} as const;

export type IconName = keyof typeof GLYPHS;

export const CIRCLES: Partial<Record<IconName, { cx: number; cy: number; r: number }[]>> = {
  group: [
    { cx: 9, cy: 9, r: 3 },
    { cx: 17, cy: 10.5, r: 2.5 },
  ],
  search: [{ cx: 10.5, cy: 10.5, r: 6 }],
  camera: [{ cx: 12, cy: 13, r: 3.5 }],
};

export interface IconProps {
  name: IconName;
  size?: number;
  tone?: ColorRole;
}
