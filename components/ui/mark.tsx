import Svg, { Path, Rect, ClipPath, Defs, G } from "react-native-svg";
import { colors } from "../../hooks/theme";

/** Phasewise's mark: a stacked pair of bands inside a rounded drop. */
export function Mark({ size = 32 }: { size?: number }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 32 32" accessibilityLabel="Phasewise">
      <Defs>
        <ClipPath id="drop">
          <Path d="M16 2 C22 10 27 15 27 21 A11 11 0 0 1 5 21 C5 15 10 10 16 2 Z" />
        </ClipPath>
      </Defs>
      <G clipPath="url(#drop)">
        <Rect x="0" y="0" width="32" height="18" fill={colors.organic} />
        <Rect x="0" y="18" width="32" height="14" fill={colors.aqueous} />
        <Rect x="0" y="17" width="32" height="2" fill={colors.surface} />
      </G>
      <Path d="M16 2 C22 10 27 15 27 21 A11 11 0 0 1 5 21 C5 15 10 10 16 2 Z" fill="none" stroke={colors.brand} strokeWidth="2" />
    </Svg>
  );
}
