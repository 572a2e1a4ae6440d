import { StyleSheet, useWindowDimensions, View } from "react-native";
import type { PlanDocument, RecoveryOutcome } from "../../knowledge/contracts/plans";
import type { EvaporationSettings, PlanResult } from "../../knowledge/plan";
import { colors, space } from "../../hooks/theme";
import { formatVolumeMl } from "../ui/format";
import { Text } from "../ui/text";
import { formatDegrees, formatMbar, formatMmol, formatPh, formatShare, solventLabel, washLabel } from "./plan-format";
import { HeadRow } from "./plan-results";
import { cautionLines, DEFER_LINE, stepRows } from "./plan-view";

export interface BenchCardProps {
  title: string;
  doc: PlanDocument;
  result: PlanResult;
  recovery?: RecoveryOutcome;
  evaporation?: EvaporationSettings;
  /** the stock added to recover, "6 M HCl" */
  reagent?: string;
  /** "Printed 14 Mar 2026, 10:20" or the saved plan's byline */
  footnote: string;
}

/**
 * The plan on one page for the bench: each pass with what to add, the pH, which layer is on top
 * and what to drain; then recovery, stripping and the cautions. Plain type, black on white, so
 * it prints well and reads under hood lights.
 */
export function BenchCard({ title, doc, result, recovery, evaporation, reagent, footnote }: BenchCardProps) {
  const rows = stepRows(doc, result);
  const cautions = cautionLines(result.warnings, recovery?.warnings, evaporation?.cautions);
  const first = result.steps[0];
  // a phone reads the steps one under another; a page or a wide screen gets the table
  const narrow = useWindowDimensions().width < 700;
  return (
    <View style={styles.card} testID="bench-card">
      <View style={styles.head}>
        <Text bold size="title" testID="bench-card-title">
          {title}
        </Text>
        <Text size="caption">{footnote}</Text>
      </View>
      <Text testID="bench-card-start">
        <Text bold>Start: </Text>
        {formatVolumeMl(doc.organic.volumeMl)} {solventLabel(doc.organic.solvent)} at {formatDegrees(doc.temperatureC)} in a {formatVolumeMl(result.funnel.funnelMl)} funnel
        {result.funnel.batches > 1 ? ` (${result.funnel.batches} batches)` : ""}, at most {Math.round(result.funnel.fillFraction * 100)} % full. The organic layer is on the{" "}
        <Text bold>{first?.top === "organic" ? "top" : first?.top === "aqueous" ? "bottom" : "—"}</Text>
        {first && result.steps.some((s) => s.top !== first.top) ? " at first — it changes; see each step" : ""}.
      </Text>
      {doc.components.length ? (
        <Text size="caption">
          Holds: {doc.components.map((c) => `${c.name} (${c.kind}${c.pKa !== undefined ? `, pKa ${c.pKa}` : ""})`).join("; ")}.
        </Text>
      ) : null}

      {narrow ? (
        <View accessibilityRole="list">
          {rows.map((r, i) => (
            <View key={r.key} style={styles.block} testID={`bench-step-${r.key}`}>
              <Text size="label" bold>
                {i + 1}. {r.volume} {r.short}
                {r.passes > 1 ? ` (${r.pass}/${r.passes})` : ""} · pH {r.aqueousPh} · {r.order}
                {r.confirm ? " (check)" : ""}
              </Text>
              <Text size="caption">
                {r.drain}
                {r.confirm ? " Densities are close: confirm with a few drops of water first." : ""}
              </Text>
              <StepNotes row={r} />
              <Text size="caption" tone="inkMuted">
                After: {r.components.map((c) => `${c.name} ${c.inOrganic}`).join(" · ")} in organic
              </Text>
            </View>
          ))}
        </View>
      ) : (
        <View style={styles.table} accessibilityRole="list">
          <HeadRow
            style={StyleSheet.flatten([styles.tr, styles.th])}
            cells={[
              ["#", styles.cNo],
              ["Add, shake, vent", styles.cAdd],
              ["pH", styles.cPh],
              ["On top", styles.cTop],
              ["Then", styles.cDrain],
            ]}
          />
          {rows.map((r, i) => (
            <View key={r.key} style={styles.tr} testID={`bench-step-${r.key}`}>
              <Text bold size="caption" style={styles.cNo}>
                {i + 1}
              </Text>
              <View style={styles.cAdd}>
                <Text size="caption" bold>
                  {r.volume} {r.short}
                  {r.passes > 1 ? ` (${r.pass}/${r.passes})` : ""}
                </Text>
                <Text size="caption">{r.components.map((c) => `${c.name} ${c.inOrganic}`).join(" · ")} in organic after</Text>
                <StepNotes row={r} />
              </View>
              <Text size="caption" style={styles.cPh}>
                {r.aqueousPh}
              </Text>
              <Text size="caption" bold style={styles.cTop}>
                {r.order.replace(" on top", "")}
                {r.confirm ? " (check)" : ""}
              </Text>
              <Text size="caption" style={styles.cDrain}>
                {r.drain}
                {r.confirm ? " Densities are close: confirm with a few drops of water first." : ""}
              </Text>
            </View>
          ))}
        </View>
      )}

      <Text size="caption" testID="bench-card-end">
        <Text bold size="caption">
          End:{" "}
        </Text>
        {result.final.components.map((c) => `${c.name} ${formatShare(c.fractionInOrganic)}`).join(" · ")} in the organic layer. Dry it before stripping.
      </Text>

      {recovery ? (
        <Text size="caption" testID="bench-card-recovery">
          <Text bold size="caption">
            Recover {recovery.component}:{" "}
          </Text>
          combine the wash {recovery.wash + 1} extracts ({formatVolumeMl(recovery.extractVolumeMl)}, {washLabel(doc.washes[recovery.wash]!)}); add about {formatVolumeMl(recovery.reagentVolumeMl)} of{" "}
          {reagent ?? "stock"} ({formatMmol(recovery.reagentMmol)}) to pH {formatPh(recovery.targetPh)}, then extract with fresh solvent.
          {recovery.co2Mmol > 0.01 ? ` About ${formatVolumeMl(recovery.co2Ml)} of CO2 comes off: open stirred flask, add in portions.` : ""}
          {recovery.temperatureRiseK >= 1 ? ` Warms by about ${Math.round(recovery.temperatureRiseK)} °C: cool in ice.` : ""}
        </Text>
      ) : null}

      {evaporation ? (
        <Text size="caption" testID="bench-card-evaporation">
          <Text bold size="caption">
            Strip:{" "}
          </Text>
          {formatMbar(evaporation.pressureMbar)} — {evaporation.solventName} boils at {formatDegrees(evaporation.boilingPointC)}; bath {formatDegrees(evaporation.bathC)}, condenser ≤ {formatDegrees(evaporation.condenserMaxC)} (20-degree rule, common
          practice).
        </Text>
      ) : null}

      <View style={styles.cautions} testID="bench-card-cautions">
        <Text bold size="caption">
          Cautions
        </Text>
        {cautions.map((c, i) => (
          <Text key={`${c.code}-${i}`} size="caption">
            • {c.message}
          </Text>
        ))}
        <Text size="caption" bold>
          {DEFER_LINE}
        </Text>
      </View>
      <Text size="caption" tone="inkMuted">
        Computed from table values: equilibrium at each pass, ideal mixing, activities ignored. Check the layer order at the funnel; keep every layer until the product is found.
      </Text>
    </View>
  );
}

/** Gas and capacity, bold, under the step they belong to. */
function StepNotes({ row }: { row: ReturnType<typeof stepRows>[number] }) {
  return (
    <>
      {row.co2Ml >= 1 ? (
        <Text size="caption" bold>
          ≈ {formatVolumeMl(row.co2Ml)} CO2: swirl open, vent after every inversion
        </Text>
      ) : null}
      {row.capacityExceeded ? (
        <Text size="caption" bold>
          Wash runs out of capacity here
        </Text>
      ) : null}
    </>
  );
}

const styles = StyleSheet.create({
  card: { backgroundColor: colors.surface, padding: space.lg, gap: space.sm, borderWidth: 1, borderColor: colors.ink, maxWidth: 900, width: "100%", alignSelf: "center" },
  head: { borderBottomWidth: 2, borderBottomColor: colors.ink, paddingBottom: space.xs, gap: 2 },
  table: { borderTopWidth: 1, borderTopColor: colors.ink },
  tr: { flexDirection: "row", gap: space.sm, paddingVertical: 4, borderBottomWidth: 1, borderBottomColor: colors.line, alignItems: "flex-start" },
  th: { borderBottomColor: colors.ink },
  cNo: { width: 18 },
  cAdd: { flex: 2.2, minWidth: 0 },
  cPh: { width: 32 },
  cTop: { width: 58 },
  cDrain: { flex: 2, minWidth: 0 },
  block: { gap: 2, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  cautions: { gap: 2, paddingTop: space.xs, borderTopWidth: 1, borderTopColor: colors.ink },
});
