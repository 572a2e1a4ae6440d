import { MARK } from "./mark-shape";

/** The same mark as mark.tsx, drawn as plain DOM svg so the web's first screen needs no react-native-svg. */
export function Mark({ size = 32 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox={MARK.viewBox} aria-label={MARK.label}>
      <defs>
        <clipPath id="drop">
          <path d={MARK.drop} />
        </clipPath>
      </defs>
      <g clipPath="url(#drop)">
        {MARK.bands.map((b) => (
          <rect key={b.y} x="0" y={String(b.y)} width="32" height={String(b.height)} fill={b.fill} />
        ))}
      </g>
      <path d={MARK.drop} fill="none" stroke={MARK.outline} strokeWidth="2" />
    </svg>
  );
}
