import { colors } from "../../hooks/theme";
import { CIRCLES, GLYPHS, type IconProps } from "./icon-glyphs";

export type { IconName } from "./icon-glyphs";

/**
 * The same glyphs as icon.tsx, drawn as plain DOM svg: on the web react-native-svg would only
 * wrap these elements, and leaving it out keeps it off the first screen's download.
 */
export function Icon({ name, size = 24, tone = "ink" }: IconProps) {
  const stroke = colors[tone];
  return (
    <svg width={size} height={size} viewBox="0 0 24 24" fill="none" aria-hidden>
      {GLYPHS[name].map((d) => (
        <path key={d} d={d} stroke={stroke} strokeWidth={2} strokeLinecap="round" strokeLinejoin="round" fill="none" />
      ))}
      {(CIRCLES[name] ?? []).map((c) => (
        <circle key={`${c.cx}-${c.cy}`} cx={c.cx} cy={c.cy} r={c.r} stroke={stroke} strokeWidth={2} fill="none" />
      ))}
    </svg>
  );
}
