import Svg, { Path, Rect, ClipPath, Defs, G } from "react-native-svg";
import { MARK } from "./mark-shape";

/** Phasewise's mark: a stacked pair of bands inside a rounded drop (native; mark.web.tsx for the web). */
export function Mark({ size = 32 }: { size?: number }) {
  return (
    <Svg width={size} height={size} viewBox={MARK.viewBox} accessibilityLabel={MARK.label}>
      <Defs>
        <ClipPath id="drop">
          <Path d={MARK.drop} />
        </ClipPath>
      </Defs>
      <G clipPath="url(#drop)">
        {MARK.bands.map((b) => (
          <Rect key={b.y} x="0" y={String(b.y)} width="32" height={String(b.height)} fill={b.fill} />
        ))}
      </G>
      <Path d={MARK.drop} fill="none" stroke={MARK.outline} strokeWidth="2" />
    </Svg>
  );
}
