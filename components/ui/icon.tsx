import Svg, { Circle, Path } from "react-native-svg";
import { colors } from "../../hooks/theme";
import { CIRCLES, GLYPHS, type IconProps } from "./icon-glyphs";

export type { IconName } from "./icon-glyphs";

/** Line glyphs drawn for Phasewise (native; icon.web.tsx draws the same paths as DOM svg). */
export function Icon({ name, size = 24, tone = "ink" }: IconProps) {
  const stroke = colors[tone];
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" fill="none" aria-hidden>
      {GLYPHS[name].map((d) => (
        <Path key={d} d={d} stroke={stroke} strokeWidth={2} strokeLinecap="round" strokeLinejoin="round" fill="none" />
      ))}
      {(CIRCLES[name] ?? []).map((c) => (
        <Circle key={`${c.cx}-${c.cy}`} cx={c.cx} cy={c.cy} r={c.r} stroke={stroke} strokeWidth={2} fill="none" />
      ))}
    </Svg>
  );
}
