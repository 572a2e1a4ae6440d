import { useState, type ReactNode } from "react";
import { StyleSheet, View, type LayoutChangeEvent } from "react-native";
import Svg, { Line, Rect, Text as SvgText } from "react-native-svg";
import { colors, fonts, radii, space, type ColorRole } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Text } from "../ui/text";

/*
 * The insight pictures, drawn with react-native-svg at the width they get. Each is an image for
 * screen readers with a sentence saying what it shows, and every chart card can show its
 * numbers as text.
 */

function useWidth(initial = 300): [number, (e: LayoutChangeEvent) => void] {
  const [w, setW] = useState(initial);
  return [w, (e) => setW(Math.max(120, Math.round(e.nativeEvent.layout.width)))];
}

const FONT = { fontFamily: fonts.regular, fontSize: 12 };

/** A chart with its title, one line of what it says, and its numbers on request. */
export function ChartCard({ title, summary, numbers, children, testID }: { title: string; summary: string; numbers: string[]; children: ReactNode; testID?: string }) {
  const [open, setOpen] = useState(false);
  return (
    <Card testID={testID}>
      <Text size="title" bold accessibilityRole="header">
        {title}
      </Text>
      <Text tone="inkMuted">{summary}</Text>
      {children}
      <Button label={open ? "Hide the numbers" : "Show the numbers"} variant="quiet" onPress={() => setOpen(!open)} testID={testID ? `${testID}-numbers` : undefined} />
      {open ? (
        <View style={styles.numbers} testID={testID ? `${testID}-table` : undefined}>
          {numbers.map((n) => (
            <Text key={n} size="label">
              {n}
            </Text>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

export interface BarRow {
  key: string;
  label: string;
  /** 0–1 of the bar's full length */
  fraction: number;
  /** shown at the bar's end: "2 of 3 · 67 %" */
  value: string;
  /** a second, lighter share drawn behind (e.g. partly cleared) */
  extra?: number;
}

/** Horizontal bars, one per row, with the label above so long names never clip. */
export function Bars({ rows, description, color = "brand", testID }: { rows: BarRow[]; description: string; color?: ColorRole; testID?: string }) {
  const [width, onLayout] = useWidth();
  const h = 18;
  return (
    <View accessible accessibilityRole="image" accessibilityLabel={description} testID={testID} style={styles.bars}>
      {rows.map((r) => (
        <View key={r.key} style={styles.barRow}>
          <View style={styles.barHead}>
            <Text size="label" style={styles.grow}>
              {r.label}
            </Text>
            <Text size="label" bold>
              {r.value}
            </Text>
          </View>
          <View onLayout={onLayout}>
            <Svg width={width} height={h} aria-hidden>
              <Rect x={0} y={0} width={width} height={h} rx={4} fill={colors.paper} stroke={colors.line} />
              {r.extra ? <Rect x={0} y={0} width={Math.min(1, r.fraction + r.extra) * width} height={h} rx={4} fill={colors[color]} fillOpacity={0.3} /> : null}
              <Rect x={0} y={0} width={Math.max(0, Math.min(1, r.fraction)) * width} height={h} rx={4} fill={colors[color]} />
            </Svg>
          </View>
        </View>
      ))}
    </View>
  );
}

export interface ColumnDatum {
  key: string;
  label: string;
  total: number;
  part: number;
}

/** Columns per period: the total in the brand colour, the part (resolved) inside it in green. */
export function Columns({ data, description, testID }: { data: ColumnDatum[]; description: string; testID?: string }) {
  const [width, onLayout] = useWidth();
  const height = 170;
  const top = 16;
  const bottom = 26;
  const left = 26;
  const plotH = height - top - bottom;
  const max = Math.max(1, ...data.map((d) => d.total));
  const slot = (width - left) / Math.max(1, data.length);
  const bar = Math.max(4, Math.min(36, slot * 0.7));
  // Label every month when there is room, else every second or third.
  const every = slot >= 30 ? 1 : slot >= 15 ? 2 : 3;
  const y = (v: number) => top + plotH - (v / max) * plotH;
  return (
    <View onLayout={onLayout} accessible accessibilityRole="image" accessibilityLabel={description} testID={testID}>
      <Svg width={width} height={height} aria-hidden>
        <Line x1={left} y1={top + plotH} x2={width} y2={top + plotH} stroke={colors.line} />
        <SvgText x={left - 6} y={top + 4} textAnchor="end" fill={colors.inkMuted} {...FONT}>
          {max}
        </SvgText>
        <SvgText x={left - 6} y={top + plotH} textAnchor="end" fill={colors.inkMuted} {...FONT}>
          0
        </SvgText>
        {data.map((d, i) => {
          const x = left + i * slot + (slot - bar) / 2;
          return (
            <Rect key={d.key} x={x} y={y(d.total)} width={bar} height={top + plotH - y(d.total)} fill={colors.brand} rx={2} />
          );
        })}
        {data.map((d, i) => {
          const x = left + i * slot + (slot - bar) / 2 + bar * 0.2;
          return d.part > 0 ? <Rect key={`${d.key}-part`} x={x} y={y(d.part)} width={bar * 0.6} height={top + plotH - y(d.part)} fill={colors.good} rx={2} /> : null;
        })}
        {data.map((d, i) =>
          i % every === 0 ? (
            <SvgText key={`${d.key}-label`} x={left + i * slot + slot / 2} y={height - 8} textAnchor="middle" fill={colors.inkMuted} {...FONT}>
              {d.label}
            </SvgText>
          ) : null,
        )}
      </Svg>
      <View style={styles.legend}>
        <View style={[styles.swatch, { backgroundColor: colors.brand }]} />
        <Text size="caption">cases</Text>
        <View style={[styles.swatch, { backgroundColor: colors.good }]} />
        <Text size="caption">of which resolved</Text>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  numbers: { gap: space.xs, backgroundColor: colors.paper, borderRadius: radii.sm, padding: space.md },
  bars: { gap: space.md },
  barRow: { gap: space.xs },
  barHead: { flexDirection: "row", gap: space.sm, alignItems: "flex-end" },
  grow: { flex: 1, minWidth: 0 },
  legend: { flexDirection: "row", alignItems: "center", gap: space.sm, flexWrap: "wrap" },
  swatch: { width: 14, height: 14, borderRadius: 3 },
});
