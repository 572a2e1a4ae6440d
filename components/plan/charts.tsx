import { useState } from "react";
import { StyleSheet, View, type LayoutChangeEvent } from "react-native";
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from "react-native-svg";
import { colors, fonts, space, type ColorRole } from "../../hooks/theme";
import { Text } from "../ui/text";
import { formatPh, formatShare } from "./plan-format";

/*
 * The plan's pictures, drawn with react-native-svg at the width they get. Each one is an image
 * for screen readers with a sentence that says what it shows; the visible labels say it too.
 */

/** Line colour and dash per component, so lines differ by more than colour. */
export const SERIES: { color: ColorRole; dash?: string }[] = [
  { color: "brand" },
  { color: "organic", dash: "8 4" },
  { color: "good", dash: "2 4" },
  { color: "danger", dash: "10 3 2 3" },
  { color: "info", dash: "4 4" },
  { color: "caution", dash: "1 3" },
];
export const seriesOf = (i: number) => SERIES[i % SERIES.length]!;

/** Shades of the aqueous colour for successive washes. */
const WASH_OPACITY = [1, 0.7, 0.45, 0.25];
export const washOpacity = (i: number) => WASH_OPACITY[i % WASH_OPACITY.length]!;

function useWidth(initial = 320): [number, (e: LayoutChangeEvent) => void] {
  const [w, setW] = useState(initial);
  return [w, (e) => setW(Math.max(200, Math.round(e.nativeEvent.layout.width)))];
}

const FONT = { fontFamily: fonts.regular, fontSize: 12 };

// ── stacked bar per component ────────────────────────────────────────────────

export interface BarSegment {
  /** "organic" or the wash index */
  part: "organic" | number;
  fraction: number;
  label: string;
}

/** One horizontal bar: what is left in the organic layer, then what each wash took. */
export function StackedBar({ segments, description, testID }: { segments: BarSegment[]; description: string; testID?: string }) {
  const [width, onLayout] = useWidth();
  const h = 30;
  let x = 0;
  return (
    <View onLayout={onLayout} accessible accessibilityRole="image" accessibilityLabel={description} testID={testID}>
      <Svg width={width} height={h} aria-hidden>
        <Rect x={0} y={0} width={width} height={h} rx={6} fill={colors.paper} stroke={colors.line} />
        {segments.map((s) => {
          const w = Math.max(0, s.fraction) * width;
          const seg = (
            <G key={String(s.part)}>
              <Rect
                x={x}
                y={0}
                width={w}
                height={h}
                fill={s.part === "organic" ? colors.organic : colors.aqueous}
                fillOpacity={s.part === "organic" ? 1 : washOpacity(s.part)}
              />
              {w >= 34 ? (
                <SvgText x={x + w / 2} y={h / 2 + 4} textAnchor="middle" fill={s.part === "organic" || washOpacity(s.part as number) > 0.5 ? colors.surface : colors.ink} {...FONT} fontWeight="bold">
                  {s.label}
                </SvgText>
              ) : null}
            </G>
          );
          x += w;
          return seg;
        })}
      </Svg>
    </View>
  );
}

// ── axes shared by the two line charts ───────────────────────────────────────

interface Frame {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}
const frameFor = (width: number, height = 220): Frame => ({ width, height, left: 44, right: 12, top: 12, bottom: 34 });
const plotW = (f: Frame) => f.width - f.left - f.right;
const plotH = (f: Frame) => f.height - f.top - f.bottom;

function PercentAxes({ f, xTicks, xLabel }: { f: Frame; xTicks: { value: number; x: number; label: string }[]; xLabel: string }) {
  const y = (pct: number) => f.top + plotH(f) * (1 - pct / 100);
  return (
    <G>
      {[0, 25, 50, 75, 100].map((p) => (
        <G key={p}>
          <Line x1={f.left} x2={f.width - f.right} y1={y(p)} y2={y(p)} stroke={colors.line} strokeWidth={p === 0 || p === 100 ? 1.5 : 1} />
          <SvgText x={f.left - 6} y={y(p) + 4} textAnchor="end" fill={colors.inkMuted} {...FONT}>
            {`${p} %`}
          </SvgText>
        </G>
      ))}
      {xTicks.map((t) => (
        <SvgText key={t.value} x={t.x} y={f.height - f.bottom + 16} textAnchor="middle" fill={colors.inkMuted} {...FONT}>
          {t.label}
        </SvgText>
      ))}
      <SvgText x={f.left + plotW(f) / 2} y={f.height - 2} textAnchor="middle" fill={colors.ink} {...FONT}>
        {xLabel}
      </SvgText>
    </G>
  );
}

const pathOf = (pts: { x: number; y: number }[]) => pts.map((p, i) => `${i === 0 ? "M" : "L"}${p.x.toFixed(1)} ${p.y.toFixed(1)}`).join(" ");

// ── fraction remaining against passes ────────────────────────────────────────

export interface PassesCurveProps {
  points: { pass: number; fractionLeft: number }[];
  /** fraction that may remain for the target recovery (e.g. 0.01 for 99 %) */
  targetLeft?: number;
  /** passes the plan makes with this wash */
  planned?: number;
  description: string;
  testID?: string;
}

export function PassesCurve({ points, targetLeft, planned, description, testID }: PassesCurveProps) {
  const [width, onLayout] = useWidth();
  const f = frameFor(width);
  const maxPass = Math.max(1, ...points.map((p) => p.pass));
  const x = (pass: number) => f.left + (plotW(f) * pass) / maxPass;
  const y = (fraction: number) => f.top + plotH(f) * (1 - Math.min(1, Math.max(0, fraction)));
  const pts = points.map((p) => ({ x: x(p.pass), y: y(p.fractionLeft) }));
  return (
    <View onLayout={onLayout} accessible accessibilityRole="image" accessibilityLabel={description} testID={testID}>
      <Svg width={width} height={f.height} aria-hidden>
        <PercentAxes f={f} xLabel="passes" xTicks={points.map((p) => ({ value: p.pass, x: x(p.pass), label: String(p.pass) }))} />
        {planned !== undefined && planned <= maxPass ? (
          <G>
            <Rect x={x(0)} y={f.top} width={x(planned) - x(0)} height={plotH(f)} fill={colors.aqueous} fillOpacity={0.1} />
            <SvgText x={x(planned) - 4} y={f.top + 14} textAnchor="end" fill={colors.aqueous} {...FONT} fontWeight="bold">
              {`planned: ${planned}`}
            </SvgText>
          </G>
        ) : null}
        {targetLeft !== undefined ? (
          <G>
            <Line x1={f.left} x2={f.width - f.right} y1={y(targetLeft)} y2={y(targetLeft)} stroke={colors.danger} strokeDasharray="6 4" strokeWidth={1.5} />
            <SvgText x={f.width - f.right - 4} y={y(targetLeft) - 6} textAnchor="end" fill={colors.danger} {...FONT}>
              {`target: ${formatShare(targetLeft)} left`}
            </SvgText>
          </G>
        ) : null}
        <Path d={pathOf(pts)} stroke={colors.brand} strokeWidth={2.5} fill="none" />
        {pts.map((p, i) => (
          <Circle key={i} cx={p.x} cy={p.y} r={4} fill={colors.surface} stroke={colors.brand} strokeWidth={2} />
        ))}
      </Svg>
    </View>
  );
}

// ── distribution against pH ─────────────────────────────────────────────────

export interface PhChartProps {
  curves: { name: string; points: { pH: number; fractionInOrganic: number }[] }[];
  marks: { label: string; pH: number }[];
  description: string;
  testID?: string;
}

export function PhChart({ curves, marks, description, testID }: PhChartProps) {
  const [width, onLayout] = useWidth();
  const f = frameFor(width, 240);
  const x = (pH: number) => f.left + (plotW(f) * Math.min(14, Math.max(0, pH))) / 14;
  const y = (fraction: number) => f.top + plotH(f) * (1 - fraction);
  // marks at the same pH share a line; their labels stack
  const byPh = new Map<string, string[]>();
  for (const m of marks) byPh.set(formatPh(m.pH), [...(byPh.get(formatPh(m.pH)) ?? []), m.label]);
  return (
    <View onLayout={onLayout} accessible accessibilityRole="image" accessibilityLabel={description} testID={testID}>
      <Svg width={width} height={f.height} aria-hidden>
        <PercentAxes f={f} xLabel="pH of the wash" xTicks={[0, 2, 4, 6, 8, 10, 12, 14].map((p) => ({ value: p, x: x(p), label: String(p) }))} />
        {[...byPh.entries()].map(([ph, labels]) => (
          <G key={ph}>
            <Line x1={x(Number(ph))} x2={x(Number(ph))} y1={f.top} y2={f.top + plotH(f)} stroke={colors.aqueous} strokeWidth={2} strokeOpacity={0.6} />
            <Rect x={x(Number(ph)) - 11} y={f.top} width={22} height={18} rx={4} fill={colors.aqueous} />
            <SvgText x={x(Number(ph))} y={f.top + 13} textAnchor="middle" fill={colors.surface} {...FONT} fontWeight="bold">
              {labels.join(",")}
            </SvgText>
          </G>
        ))}
        {curves.map((c, i) => {
          const s = seriesOf(i);
          return (
            <Path
              key={c.name}
              d={pathOf(c.points.map((p) => ({ x: x(p.pH), y: y(p.fractionInOrganic) })))}
              stroke={colors[s.color]}
              strokeWidth={2.5}
              strokeDasharray={s.dash}
              fill="none"
            />
          );
        })}
      </Svg>
    </View>
  );
}

/** A legend row: the line sample and its name. */
export function SeriesKey({ index, label }: { index: number; label: string }) {
  const s = seriesOf(index);
  return (
    <View style={styles.key}>
      <Svg width={28} height={12} aria-hidden>
        <Line x1={0} x2={28} y1={6} y2={6} stroke={colors[s.color]} strokeWidth={3} strokeDasharray={s.dash} />
      </Svg>
      <Text size="caption">{label}</Text>
    </View>
  );
}

/** A legend swatch for the bars. */
export function Swatch({ part, label }: { part: "organic" | number; label: string }) {
  return (
    <View style={styles.key}>
      <Svg width={16} height={16} aria-hidden>
        <Rect x={0} y={0} width={16} height={16} rx={3} fill={part === "organic" ? colors.organic : colors.aqueous} fillOpacity={part === "organic" ? 1 : washOpacity(part)} />
      </Svg>
      <Text size="caption">{label}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  key: { flexDirection: "row", alignItems: "center", gap: space.xs },
});
