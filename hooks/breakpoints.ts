import { useWindowDimensions } from "react-native";

/** One breakpoint swaps the shell: bottom tabs below it, a side rail at or above it. */
export const WIDE_MIN_PX = 900;
/** Width of the centred content column on wide screens. */
export const COLUMN_MAX_PX = 760;

export type Layout = "phone" | "wide";

export function layoutFor(widthPx: number): Layout {
  return widthPx >= WIDE_MIN_PX ? "wide" : "phone";
}

export function useLayout(): Layout {
  return layoutFor(useWindowDimensions().width);
}
