import { StyleSheet, View } from "react-native";
import Svg, { Line, Rect } from "react-native-svg";
import { colors, space } from "../../hooks/theme";
import { Text } from "../ui/text";

export type BandPhase = "organic" | "aqueous";

export interface BandColumn {
  /** "Predicted", "Seen" */
  label: string;
  /** top to bottom; null when unknown (drawn as an empty outline) */
  order: [BandPhase, BandPhase] | null;
  /** volumes, to scale the bands; equal halves when absent */
  organicMl?: number;
  aqueousMl?: number;
}

const W = 64;
const H = 120;
const MIN_BAND = 0.15;

function heights(c: BandColumn): { top: number; bottom: number } {
  if (!c.order) return { top: H / 2, bottom: H / 2 };
  const vol = { organic: c.organicMl ?? 1, aqueous: c.aqueousMl ?? 1 };
  const total = vol.organic + vol.aqueous || 2;
  let topShare = vol[c.order[0]] / total;
  // Keep both bands readable however lopsided the volumes are.
  topShare = Math.min(Math.max(topShare, MIN_BAND), 1 - MIN_BAND);
  return { top: H * topShare, bottom: H * (1 - topShare) };
}

const PHASE_NAME: Record<BandPhase, string> = { organic: "organic", aqueous: "aqueous" };

function describe(c: BandColumn): string {
  if (!c.order) return `${c.label}: not known`;
  return `${c.label}: ${PHASE_NAME[c.order[0]]} on top, ${PHASE_NAME[c.order[1]]} below`;
}

/**
 * Plain columns of layers, to scale by volume, for a case whose names are not in the tables
 * (so there are no densities for the funnel drawing).
 */
export function PhaseBands({ columns, testID }: { columns: BandColumn[]; testID?: string }) {
  return (
    <View style={styles.wrap} testID={testID} accessible accessibilityLabel={columns.map(describe).join(". ")}>
      <View style={styles.row}>
        {columns.map((c) => {
          const h = heights(c);
          return (
            <View key={c.label} style={styles.col}>
              <Svg width={W} height={H + 4} viewBox={`-2 -2 ${W + 4} ${H + 4}`} aria-hidden>
                {c.order ? (
                  <>
                    <Rect x={0} y={0} width={W} height={h.top} fill={colors[c.order[0]]} />
                    <Rect x={0} y={h.top} width={W} height={h.bottom} fill={colors[c.order[1]]} />
                    <Line x1={0} x2={W} y1={h.top} y2={h.top} stroke={colors.surface} strokeWidth={2} />
                  </>
                ) : null}
                <Rect x={0} y={0} width={W} height={H} rx={6} fill="none" stroke={colors.ink} strokeWidth={2} strokeDasharray={c.order ? undefined : "6 4"} />
              </Svg>
              <Text bold size="label">
                {c.label}
              </Text>
              <Text size="caption" tone="inkMuted" align="center">
                {c.order ? `${PHASE_NAME[c.order[1]]} at the bottom` : "not recorded"}
              </Text>
            </View>
          );
        })}
        <View style={styles.legend}>
          <LegendSwatch phase="organic" />
          <LegendSwatch phase="aqueous" />
        </View>
      </View>
    </View>
  );
}

function LegendSwatch({ phase }: { phase: BandPhase }) {
  return (
    <View style={styles.swatchRow}>
      <View style={[styles.swatch, { backgroundColor: colors[phase] }]} />
      <Text size="caption">{PHASE_NAME[phase]}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  row: { flexDirection: "row", gap: space.xl, alignItems: "flex-start", flexWrap: "wrap" },
  col: { alignItems: "center", gap: space.xs, width: W + 40 },
  legend: { gap: space.sm, justifyContent: "center", alignSelf: "center" },
  swatchRow: { flexDirection: "row", alignItems: "center", gap: space.sm },
  swatch: { width: 18, height: 18, borderRadius: 4, borderWidth: 1, borderColor: colors.ink },
});
