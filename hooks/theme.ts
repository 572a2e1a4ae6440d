/** Design tokens. Screens use these roles, never raw colours or font names. */
export const colors = {
  ink: "#14263A",
  inkMuted: "#4A5B6C",
  paper: "#F5F3EE",
  surface: "#FFFFFF",
  line: "#CBD2D9",
  brand: "#17324D",
  brandInk: "#FFFFFF",
  focus: "#2F6FD0",
  /** the two phases, used in drawings and legends */
  organic: "#D98E2B",
  organicSoft: "#F7E3C4",
  aqueous: "#2C8C99",
  aqueousSoft: "#CDE9EC",
  good: "#1E7A46",
  goodSoft: "#DDF1E4",
  caution: "#8A5A00",
  cautionSoft: "#FCEFC9",
  danger: "#A8321F",
  dangerSoft: "#F9DDD7",
  info: "#2A5A8C",
  infoSoft: "#DCE8F5",
} as const;

export type ColorRole = keyof typeof colors;

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;
export const radii = { sm: 6, md: 10, lg: 16, pill: 999 } as const;

export const fonts = {
  regular: "AtkinsonHyperlegible_400Regular",
  bold: "AtkinsonHyperlegible_700Bold",
} as const;

export const type = {
  caption: { fontSize: 13, lineHeight: 18 },
  body: { fontSize: 16, lineHeight: 23 },
  label: { fontSize: 15, lineHeight: 20 },
  title: { fontSize: 20, lineHeight: 26 },
  headline: { fontSize: 26, lineHeight: 32 },
  answer: { fontSize: 30, lineHeight: 36 },
} as const;

export type TypeRole = keyof typeof type;

/** Minimum touch target (gloved hands at the hood). */
export const TOUCH_MIN = 48;

export type Tone = "neutral" | "good" | "caution" | "danger" | "info";

export const toneColors: Record<Tone, { fg: ColorRole; bg: ColorRole }> = {
  neutral: { fg: "ink", bg: "surface" },
  good: { fg: "good", bg: "goodSoft" },
  caution: { fg: "caution", bg: "cautionSoft" },
  danger: { fg: "danger", bg: "dangerSoft" },
  info: { fg: "info", bg: "infoSoft" },
};
