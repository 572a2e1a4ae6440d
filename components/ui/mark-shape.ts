import { colors } from "../../hooks/theme";

/** Phasewise's mark on a 32 × 32 grid, shared by the native and web marks. */
export const MARK = {
  label: "Phasewise",
  viewBox: "0 0 32 32",
  /** the rounded drop that clips the bands and is outlined on top of them */
  drop: "M16 2 C22 10 27 15 27 21 A11 11 0 0 1 5 21 C5 15 10 10 16 2 Z",
  outline: colors.brand,
  /** organic above, aqueous below, a surface-coloured meniscus between */
  bands: [
    { y: 0, height: 18, fill: colors.organic },
    { y: 18, height: 14, fill: colors.aqueous },
    { y: 17, height: 2, fill: colors.surface },
  ],
} as const;
