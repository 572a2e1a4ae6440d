import { View } from "react-native";
import Svg, { ClipPath, Defs, G, Line, Path, Rect, Text as SvgText } from "react-native-svg";
import { colors, fonts } from "../../hooks/theme";
import { formatDensity, formatVolumeMl } from "../ui/format";

export type DrawnPhase = "organic" | "aqueous" | "mixed";

export interface DrawnLayer {
  phase: DrawnPhase;
  /** "Organic", "Aqueous", "One phase" */
  label: string;
  volumeMl: number;
  /** null when not known (a single mixed phase) */
  densityGPerMl: number | null;
}

export interface FunnelDrawingProps {
  /** top to bottom: two layers, one for a single phase, none for an empty funnel */
  layers: DrawnLayer[];
  /** drawing width in px; the height follows */
  width?: number;
  testID?: string;
}

// Drawing units (the funnel is 130 wide, labels use the rest of a 300-wide box).
const VIEW_W = 300;
const VIEW_H = 232;
const BODY =
  "M57 34 C57 52 14 58 14 88 L60 188 L70 188 L116 88 C116 58 73 52 73 34 Z";
const FILL_TOP = 74;
const FILL_BOTTOM = 188;
/** A layer never shrinks below this share of the liquid height, so a thin layer stays visible. */
const MIN_SHARE = 0.12;
const LABEL_X = 134;
const LABEL_GAP = 46;

const FILL: Record<DrawnPhase, string> = { organic: colors.organic, aqueous: colors.aqueous, mixed: colors.organicSoft };

/** x of the funnel's right wall at height y (for the leader lines). */
function rightWall(y: number): number {
  if (y <= 88) return 116;
  return 116 - ((y - 88) * (116 - 70)) / (188 - 88);
}

/** Heights in proportion to volume (within MIN_SHARE), top to bottom. */
export function layerBands(layers: DrawnLayer[]): { y: number; h: number }[] {
  const total = layers.reduce((s, l) => s + l.volumeMl, 0) || 1;
  const H = FILL_BOTTOM - FILL_TOP;
  let y = FILL_TOP;
  return layers.map((l, i) => {
    const share = layers.length === 1 ? 1 : Math.min(Math.max(l.volumeMl / total, MIN_SHARE), 1 - MIN_SHARE);
    const h = i === layers.length - 1 ? FILL_BOTTOM - y : H * share;
    const band = { y, h };
    y += h;
    return band;
  });
}

export function describeFunnel(layers: DrawnLayer[]): string {
  if (layers.length === 0) return "Funnel drawing: empty until the solvent and the aqueous phase are chosen.";
  const where = layers.length === 1 ? ["The whole liquid"] : ["Top layer", "Bottom layer"];
  const parts = layers.map((l, i) => [`${where[i]}: ${l.label.toLowerCase()}`, formatVolumeMl(l.volumeMl), l.densityGPerMl === null ? undefined : formatDensity(l.densityGPerMl)].filter(Boolean).join(", "));
  return `Funnel drawing. ${parts.join(". ")}. Layer heights are drawn in proportion to volume.`;
}

/** A separatory funnel with the predicted layers, heights in proportion to volume, each labelled. */
export function FunnelDrawing({ layers, width = VIEW_W, testID }: FunnelDrawingProps) {
  const bands = layerBands(layers);
  // Label centres follow their layers but never crowd each other.
  const labelY: number[] = [];
  bands.forEach((b, i) => {
    const mid = b.y + b.h / 2;
    labelY.push(i === 0 ? Math.min(mid, FILL_BOTTOM - LABEL_GAP * (bands.length - 1)) : Math.max(mid, labelY[i - 1]! + LABEL_GAP));
  });
  return (
    <View testID={testID} accessible accessibilityRole="image" accessibilityLabel={describeFunnel(layers)}>
      <Svg width={width} height={(width * VIEW_H) / VIEW_W} viewBox={`0 0 ${VIEW_W} ${VIEW_H}`} aria-hidden>
        <Defs>
          <ClipPath id="funnel-body">
            <Path d={BODY} />
          </ClipPath>
        </Defs>
        <Path d={BODY} fill={colors.surface} />
        <G clipPath="url(#funnel-body)">
          {layers.map((l, i) => (
            <Rect key={`band-${i}`} x={0} y={bands[i]!.y} width={130} height={bands[i]!.h} fill={FILL[l.phase]} />
          ))}
          {bands.slice(1).map((b, i) => (
            <Line key={`interface-${i}`} x1={0} x2={130} y1={b.y} y2={b.y} stroke={colors.surface} strokeWidth={2.5} />
          ))}
        </G>
        <Path d={BODY} fill="none" stroke={colors.brand} strokeWidth={3} strokeLinejoin="round" />
        {/* stopper, stopcock and stem */}
        <Rect x={54} y={6} width={22} height={14} rx={3} fill={colors.brand} />
        <Rect x={61} y={188} width={8} height={14} fill={colors.brand} />
        <Rect x={46} y={191} width={38} height={8} rx={3} fill={colors.brand} />
        <Rect x={63} y={202} width={4} height={26} fill={colors.brand} />
        {layers.map((l, i) => {
          const mid = bands[i]!.y + bands[i]!.h / 2;
          const y = labelY[i]!;
          return (
            <G key={`label-${i}`}>
              <Line x1={rightWall(mid) + 4} y1={mid} x2={LABEL_X - 6} y2={y} stroke={colors.inkMuted} strokeWidth={1.5} />
              <SvgText x={LABEL_X} y={y - 3} fontSize={16} fontFamily={fonts.bold} fill={colors.ink}>
                {`${l.label} · ${formatVolumeMl(l.volumeMl)}`}
              </SvgText>
              <SvgText x={LABEL_X} y={y + 16} fontSize={15} fontFamily={fonts.regular} fill={colors.inkMuted}>
                {l.densityGPerMl === null ? "mixed" : formatDensity(l.densityGPerMl)}
              </SvgText>
            </G>
          );
        })}
      </Svg>
    </View>
  );
}
