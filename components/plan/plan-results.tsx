import { useState } from "react";
import { StyleSheet, View, type StyleProp, type TextStyle, type ViewStyle } from "react-native";
import type { PlanDocument } from "../../knowledge/contracts/plans";
import { planSourceRefs } from "../../knowledge/contracts/plans";
import type { PlanResult } from "../../knowledge/plan";
import { useLayout } from "../../hooks/breakpoints";
import { colors, radii, space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { formatDensity, formatVolumeMl } from "../ui/format";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { PhChart, SeriesKey, StackedBar, Swatch, type BarSegment } from "./charts";
import { formatPh, formatShare, solventLabel, washLabel } from "./plan-format";
import { componentFates, distributionCurves, fateSentence, halfPointPh, phMarks, stepRows, washSummary, type ComponentFate } from "./plan-view";

export interface ResultsProps {
  doc: PlanDocument;
  result: PlanResult;
}

/** The answer first: where each component ends up, as a number and a bar. */
export function PlanAnswer({ doc, result }: ResultsProps) {
  const fates = componentFates(doc, result);
  return (
    <Card testID="plan-answer">
      <Text bold size="title" accessibilityRole="header">
        Where each component ends up
      </Text>
      <Text tone="inkMuted">
        {formatVolumeMl(doc.organic.volumeMl)} {solventLabel(doc.organic.solvent)} through {doc.washes.length} wash{doc.washes.length === 1 ? "" : "es"}, {result.steps.length} pass
        {result.steps.length === 1 ? "" : "es"}.
      </Text>
      {fates.length === 0 ? <Text>Add components to see where they go; the steps below already show the layer order.</Text> : null}
      {fates.map((f, i) => (
        <FateRow key={`${f.name}-${i}`} fate={f} doc={doc} index={i} />
      ))}
      {fates.length > 0 ? (
        <View style={styles.legend}>
          <Swatch part="organic" label="left in the organic layer" />
          {doc.washes.map((_w, wi) => (
            <Swatch key={wi} part={wi} label={`W${wi + 1}: ${washLabel(doc.washes[wi]!)}`} />
          ))}
        </View>
      ) : null}
    </Card>
  );
}

function FateRow({ fate, doc, index }: { fate: ComponentFate; doc: PlanDocument; index: number }) {
  const segments: BarSegment[] = [
    { part: "organic", fraction: fate.left, label: "org" },
    ...fate.perWash.map((share, wi) => ({ part: wi, fraction: share, label: `W${wi + 1}` })),
  ];
  const main = fate.left >= 0.5 || fate.removedBy.length === 0 ? `${formatShare(fate.left)} stays` : `${formatShare(1 - fate.left)} washed out`;
  return (
    <View style={styles.fate} testID={`plan-fate-${index}`}>
      <View style={styles.fateHead}>
        <Text bold style={styles.shrink}>
          {fate.name}
          <Text tone="inkMuted"> · {fate.kind}</Text>
        </Text>
        <Text bold size="title" tone={fate.left >= 0.5 ? "organic" : "aqueous"}>
          {main}
        </Text>
      </View>
      <StackedBar segments={segments} description={fateSentence(fate, doc)} testID={`plan-bar-${index}`} />
      <Text size="caption" tone="inkMuted">
        {fate.removedBy.length
          ? `Taken by ${fate.removedBy.map((wi) => `wash ${wi + 1}`).join(" and ")}; ${formatShare(fate.left)} left in the organic layer.`
          : `No wash takes 5 % or more; ${formatShare(fate.left)} left in the organic layer.`}
      </Text>
    </View>
  );
}

/** Pass by pass: the pH, which layer is on top, what to drain, and where each component is. */
export function StepTable({ doc, result }: ResultsProps) {
  const rows = stepRows(doc, result);
  const wide = useLayout() === "wide";
  return (
    <Card testID="plan-steps">
      <Text bold size="title" accessibilityRole="header">
        Pass by pass
      </Text>
      {wide ? (
        <View accessibilityRole="list">
          <HeadRow
            style={StyleSheet.flatten([styles.tr, styles.th])}
            cells={[
              ["Pass", styles.cStep],
              ["Wash", styles.cWash],
              ["pH", styles.cPh],
              ["On top", styles.cOrder],
              ["Still in the organic layer", styles.cComp],
            ]}
          />
          {rows.map((r) => (
            <View key={r.key} style={styles.tr} testID={`plan-step-${r.key}`} accessible accessibilityLabel={rowSentence(r)}>
              <Text style={styles.cStep}>
                {r.wash + 1}.{r.pass}
              </Text>
              <Text style={styles.cWash}>
                {r.volume} {r.short}
              </Text>
              <Text style={styles.cPh}>{r.aqueousPh}</Text>
              <Text style={styles.cOrder} tone={r.order.startsWith("organic") ? "organic" : "aqueous"} bold>
                {r.order.replace(" on top", "")}
              </Text>
              <View style={styles.cComp}>
                {r.components.map((c) => (
                  <View key={c.name} style={styles.compLine}>
                    <Text size="label" style={styles.shrink} numberOfLines={1}>
                      {c.name}
                    </Text>
                    <Text size="label" bold>
                      {c.inOrganic}
                    </Text>
                  </View>
                ))}
              </View>
            </View>
          ))}
        </View>
      ) : (
        rows.map((r) => (
          <View key={r.key} style={styles.stepCard} testID={`plan-step-${r.key}`} accessible accessibilityLabel={rowSentence(r)}>
            <View style={styles.fateHead}>
              <Text bold style={styles.shrink}>
                Wash {r.wash + 1}, pass {r.pass} of {r.passes}
              </Text>
              <Text bold>pH {r.aqueousPh}</Text>
            </View>
            <Text>
              {r.volume} {r.short} · <Text bold tone={r.order.startsWith("organic") ? "organic" : "aqueous"}>{r.order}</Text>
            </Text>
            {r.components.map((c) => (
              <View key={c.name} style={styles.fateHead}>
                <Text size="caption" style={styles.shrink}>
                  {c.name}
                </Text>
                <Text size="caption" bold>
                  {c.inOrganic} in organic
                </Text>
              </View>
            ))}
          </View>
        ))
      )}
      <Text size="caption" tone="inkMuted">
        pH is the aqueous layer's once it has taken up the components (the fresh wash's pH is on the bench card). Percentages are shares of the starting amount still in the organic layer.
      </Text>
    </Card>
  );
}

/** A table's header row: bold captions in the columns' widths. */
export function HeadRow({ cells, style }: { cells: [string, StyleProp<ViewStyle>][]; style: StyleProp<ViewStyle> }) {
  return (
    <View style={style}>
      {cells.map(([label, cellStyle]) => (
        <Text key={label} bold size="caption" style={cellStyle as StyleProp<TextStyle>}>
          {label}
        </Text>
      ))}
    </View>
  );
}

function rowSentence(r: ReturnType<typeof stepRows>[number]): string {
  return `Wash ${r.wash + 1}, pass ${r.pass}: ${r.volume} ${r.solution}, aqueous pH ${r.aqueousPh}, ${r.order}. ${r.components.map((c) => `${c.name} ${c.inOrganic} in the organic layer`).join("; ")}.`;
}

/** Each component's one-pass split against pH, with the washes marked. */
export function PhSection({ doc, result }: ResultsProps) {
  if (doc.components.length === 0) return null;
  const curves = distributionCurves(doc);
  const marks = phMarks(result);
  const halves = curves.map((c) => ({ name: c.name, half: halfPointPh(c.points) }));
  const description = `Share of each component left in the organic layer after one pass, against the wash's pH from 0 to 14. Washes marked at ${marks
    .map((m) => `pH ${formatPh(m.pH)} (wash ${m.label})`)
    .join(", ")}. ${halves.map((h) => (h.half === null ? `${h.name}: the same at every pH.` : `${h.name}: half stays at pH ${formatPh(h.half)}.`)).join(" ")}`;
  const vAq = doc.washes[0]?.volumeMl ?? doc.organic.volumeMl;
  return (
    <Card testID="plan-ph">
      <Text bold size="title" accessibilityRole="header">
        Against pH
      </Text>
      <Text tone="inkMuted">
        One pass, {formatVolumeMl(doc.organic.volumeMl)} organic against {formatVolumeMl(vAq)}: the share left in the organic layer (Henderson–Hasselbalch, D = K × neutral fraction).
      </Text>
      <PhChart curves={curves} marks={marks} description={description} testID="plan-ph-chart" />
      <View style={styles.legend}>
        {curves.map((c, i) => (
          <SeriesKey key={i} index={i} label={c.name} />
        ))}
      </View>
      {halves.map((h) => (
        <Text key={h.name} size="caption">
          {h.half === null ? `${h.name}: pH does not move it (neutral or outside 0–14).` : `${h.name}: half stays in the organic layer at pH ${formatPh(h.half)}.`}
        </Text>
      ))}
      <Text size="caption" tone="inkMuted">
        Marks: {marks.map((m) => `${m.label} = ${washSummary(doc, Number(m.label) - 1)} (pH ${formatPh(m.pH)})`).join("; ")}.
      </Text>
    </Card>
  );
}

/** The plan's cautions and notes, each on its own line. */
export function PlanWarnings({ result }: { result: PlanResult }) {
  if (result.warnings.length === 0) return null;
  return (
    <Card testID="plan-warnings">
      <Text bold size="title" accessibilityRole="header">
        Watch for
      </Text>
      {result.warnings.map((w, i) => (
        <Notice key={`${w.code}-${i}`} tone={w.code.startsWith("co2") || w.code === "wash-capacity" || w.code === "ester-hydrolysis" ? "caution" : "info"}>
          {w.message}
        </Notice>
      ))}
    </Card>
  );
}

/** What the numbers rest on, folded away until asked for. */
export function PlanBasis({ result }: { result: PlanResult }) {
  const [open, setOpen] = useState(false);
  return (
    <Card testID="plan-basis">
      <View style={styles.fateHead}>
        <Text bold size="title" accessibilityRole="header" style={styles.shrink}>
          What this rests on
        </Text>
        <Button label={open ? "Hide" : "Show"} variant="quiet" onPress={() => setOpen(!open)} testID="plan-basis-toggle" />
      </View>
      <Text size="caption" tone="inkMuted">
        Equilibrium at every pass, ideal mixing, activities ignored; layer order from table densities ({formatDensity(result.steps[0]?.densityDifferenceGPerMl ?? 0)} apart at the first pass).
      </Text>
      {open ? (
        <View style={styles.basis}>
          {result.assumptions.map((a) => (
            <Text key={a} size="caption">
              • {a}
            </Text>
          ))}
          <Text bold size="label">
            Sources
          </Text>
          {planSourceRefs(result.sources).map((s) => (
            <Text key={s.key} size="caption" tone="inkMuted">
              • {s.title}
            </Text>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  legend: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  fate: { gap: space.xs },
  fateHead: { flexDirection: "row", justifyContent: "space-between", alignItems: "baseline", gap: space.sm, flexWrap: "wrap" },
  shrink: { flexShrink: 1 },
  tr: { flexDirection: "row", alignItems: "flex-start", gap: space.sm, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  th: { borderBottomWidth: 2, borderBottomColor: colors.ink },
  cStep: { width: 36 },
  cWash: { width: 130 },
  cPh: { width: 36 },
  cOrder: { width: 64 },
  cComp: { flex: 1, minWidth: 0, gap: 2 },
  compLine: { flexDirection: "row", justifyContent: "space-between", gap: space.sm },
  stepCard: { gap: space.xs, padding: space.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.paper },
  basis: { gap: space.xs },
});
