import { useState } from "react";
import { StyleSheet, View } from "react-native";
import {
  CLEAR_DENSITY_DIFFERENCE_G_PER_ML,
  DEFAULT_DISSOLVED_DENSITY_G_PER_ML,
  TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML,
  type LayerConfidence,
  type LayerInput,
  type LayerPrediction,
  type Phase,
} from "../../knowledge/layers";
import { sourceTitle } from "../../knowledge/contracts/solvents";
import type { KnowledgeWarning } from "../../knowledge/types";
import { colors, radii, space, toneColors, type Tone } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { formatConcentration, formatDensity, formatPercent, formatTemperatureC, formatVolumeMl } from "../ui/format";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { FunnelDrawing, type DrawnLayer } from "./funnel-drawing";
import type { LayerEvaluation } from "./layer-draft";

/** Warnings about the order itself: shown in the answer. */
const ORDER_CODES = new Set(["inverted-order", "inversion-risk", "near-density", "load-changes-order", "one-phase"]);
/** Safety cautions: shown together with the one line that defers to the SDS. */
const SAFETY_CODES = new Set(["halogenated", "peroxide-former", "very-low-flash-point", "near-boiling", "gas-evolution", "corrosive-aqueous"]);

export const isOrderWarning = (w: KnowledgeWarning) => ORDER_CODES.has(w.code);
export const isSafetyWarning = (w: KnowledgeWarning) => SAFETY_CODES.has(w.code);

const CONFIDENCE: Record<LayerConfidence, { label: string; tone: Tone }> = {
  clear: { label: "Clear call", tone: "good" },
  close: { label: "Close: confirm", tone: "caution" },
  "too-close": { label: "Too close to call", tone: "danger" },
  "one-phase": { label: "One phase", tone: "caution" },
};

/** "a", "a and b", "a, b and c" */
const listWords = (items: string[]) => (items.length <= 1 ? (items[0] ?? "") : `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`);

const lowerFirst = (name: string) => (/^[A-Z][a-z]/.test(name) ? name[0]!.toLowerCase() + name.slice(1) : name);

export function organicWords(p: LayerPrediction): string {
  return p.organicParts.map((o) => lowerFirst(o.name)).join(" + ");
}

export function aqueousWords(input: LayerInput, p: LayerPrediction): string {
  const name = lowerFirst(p.aqueous.name);
  const c = input.aqueous.concentration;
  if (p.aqueous.key === "water" || !c) return name;
  if (c === "saturated") return `saturated ${name} (${formatPercent(p.aqueous.massFractionPct)} w/w)`;
  return `${formatConcentration(c)} ${name}`;
}

/** "organic on the bottom", for lists of recent checks. */
export function answerWords(p: LayerPrediction): string {
  return p.phases === 1 ? "one phase" : `organic on the ${p.top === "organic" ? "top" : "bottom"}`;
}

function marginLine(p: LayerPrediction): string {
  const d = formatDensity(p.densityDifferenceGPerMl);
  const clear = CLEAR_DENSITY_DIFFERENCE_G_PER_ML.toFixed(3);
  switch (p.confidence) {
    case "clear":
      return `Margin ${d}: a clear call needs ${clear} or more.`;
    case "close":
      return `Margin only ${d} (clear from ${clear}): probably right, but confirm before draining.`;
    case "too-close":
      return `Margin ${d}, under ${TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML.toFixed(3)}: the densities cannot decide the order.`;
    case "one-phase":
      return "Expect a single liquid phase, not two layers.";
  }
}

/** What the numbers rest on, in one short line (UX: no footnote hunt). */
export function restsOn(input: LayerInput, p: LayerPrediction): string | null {
  const parts = [
    p.organicParts.length > 1 ? "ideal mixing of the solvents assumed" : undefined,
    (input.dissolvedSolidsG ?? 0) > 0 ? `dissolved product taken as ${DEFAULT_DISSOLVED_DENSITY_G_PER_ML.toFixed(1)} g/mL` : undefined,
    input.temperatureC !== 20 ? `densities corrected from 20 °C to ${formatTemperatureC(input.temperatureC)}` : undefined,
  ].filter(Boolean);
  return parts.length ? `${parts.join("; ")}.`.replace(/^./, (c) => c.toUpperCase()) : null;
}

function drawnLayers(input: LayerInput, p: LayerPrediction): DrawnLayer[] {
  if (p.phases === 1) return [{ phase: "mixed", label: "One phase", volumeMl: p.totalVolumeMl, densityGPerMl: null }];
  const layer = (phase: Phase): DrawnLayer =>
    phase === "organic"
      ? { phase, label: "Organic", volumeMl: p.organicVolumeMl, densityGPerMl: p.organicDensityGPerMl }
      : { phase, label: "Aqueous", volumeMl: p.aqueousVolumeMl, densityGPerMl: p.aqueousDensityGPerMl };
  return [layer(p.top!), layer(p.bottom!)];
}

function LayerRow({
  position,
  phase,
  words,
  densityGPerMl,
  unsure,
}: {
  position: "Top" | "Bottom";
  phase: Phase | null;
  words: string;
  densityGPerMl?: number;
  /** the densities cannot decide: the headline asks instead of telling */
  unsure?: boolean;
}) {
  const headline = phase ? `${position} layer: ${phase}${unsure ? "?" : ""}` : `${position} layer: —`;
  const detail = phase && densityGPerMl !== undefined ? `${words}, ${formatDensity(densityGPerMl)}` : words;
  return (
    <View style={styles.layerRow} accessible accessibilityLabel={phase ? `${headline} — ${detail}` : `${position} layer not known yet`}>
      <View style={[styles.swatch, { backgroundColor: phase ? colors[phase] : colors.line }]} />
      <View style={styles.layerText}>
        <Text size="headline" testID={`answer-${position.toLowerCase()}`}>
          {headline}
        </Text>
        <Text size="title" tone="inkMuted">
          {detail}
        </Text>
      </View>
    </View>
  );
}

function Badge({ label, tone }: { label: string; tone: Tone }) {
  const t = toneColors[tone];
  return (
    <View style={[styles.badge, { backgroundColor: colors[t.bg], borderColor: colors[t.fg] }]}>
      <Text bold tone={t.fg}>
        {label}
      </Text>
    </View>
  );
}

export interface LayerAnswerProps {
  evaluation: LayerEvaluation;
  /** drawing width; the card's width on a phone */
  drawingWidth?: number;
}

/**
 * The answer, first and large: which layer is on top and which below (with densities), how sure
 * that is and by what margin, the funnel drawing, and anything that puts the order in doubt.
 * Keeps its shape while the system is incomplete so the form below does not jump.
 */
export function LayerAnswer({ evaluation, drawingWidth = 300 }: LayerAnswerProps) {
  if (evaluation.status !== "ok") {
    const message =
      evaluation.status === "incomplete"
        ? `Choose ${listWords(evaluation.missing)}: the answer appears here as you go.`
        : `Not yet: ${Object.values(evaluation.errors)[0] ?? "check the marked field."}`;
    return (
      <Card testID="layer-answer">
        <LayerRow position="Top" phase={null} words="" />
        <LayerRow position="Bottom" phase={null} words="" />
        <Text tone={evaluation.status === "invalid" ? "danger" : "inkMuted"} testID="answer-waiting" accessibilityLiveRegion="polite">
          {message}
        </Text>
        <View style={styles.drawing}>
          <FunnelDrawing layers={[]} width={drawingWidth} testID="funnel-drawing" />
        </View>
      </Card>
    );
  }
  const { input, prediction: p } = evaluation;
  const c = CONFIDENCE[p.confidence];
  const organic = { words: organicWords(p), density: p.organicDensityGPerMl };
  const aqueous = { words: aqueousWords(input, p), density: p.aqueousDensityGPerMl };
  const at = (phase: Phase | null) => (phase === "organic" ? organic : aqueous);
  const orderNotes = p.warnings.filter(isOrderWarning);
  const unsure = p.confidence === "too-close";
  return (
    <Card testID="layer-answer">
      {p.phases === 2 ? (
        <>
          <LayerRow position="Top" phase={p.top} words={at(p.top).words} densityGPerMl={at(p.top).density} unsure={unsure} />
          <LayerRow position="Bottom" phase={p.bottom} words={at(p.bottom).words} densityGPerMl={at(p.bottom).density} unsure={unsure} />
        </>
      ) : (
        <View style={styles.layerText} accessible>
          <Text size="headline" testID="answer-one-phase">
            One phase: no layers to separate
          </Text>
          <Text size="title" tone="inkMuted">
            {`${organic.words} with ${aqueous.words}`}
          </Text>
        </View>
      )}
      <View style={styles.certainty} testID="answer-certainty">
        <Badge label={c.label} tone={c.tone} />
        <Text style={styles.grow}>{marginLine(p)}</Text>
      </View>
      {restsOn(input, p) ? (
        <Text size="caption" tone="inkMuted" testID="answer-rests-on">
          {restsOn(input, p)}
        </Text>
      ) : null}
      {orderNotes.map((w) => (
        <Notice key={w.code} tone="caution" testID={`warning-${w.code}`}>
          {w.message}
        </Notice>
      ))}
      <View style={styles.drawing}>
        <FunnelDrawing layers={drawnLayers(input, p)} width={drawingWidth} testID="funnel-drawing" />
      </View>
    </Card>
  );
}

/** What else to know before draining: how to confirm, notes on the phases, and safety cautions. */
export function LayerNotes({ prediction: p }: { prediction: LayerPrediction }) {
  const other = p.warnings.filter((w) => !isOrderWarning(w) && !isSafetyWarning(w));
  const safety = p.warnings.filter(isSafetyWarning);
  return (
    <View style={styles.stack}>
      {p.confirm && p.phases === 2 ? (
        <Notice tone="info" title="How to confirm" testID="how-to-confirm">
          {p.confirm}
        </Notice>
      ) : null}
      {other.map((w) => (
        <Notice key={w.code} tone="info" testID={`warning-${w.code}`}>
          {w.message}
        </Notice>
      ))}
      {safety.length ? (
        <Notice tone="caution" title="Cautions" testID="cautions">
          {safety.map((w) => (
            <Text key={w.code} testID={`warning-${w.code}`}>
              {`• ${w.message}`}
            </Text>
          ))}
          <Text size="caption" tone="inkMuted">
            Reminders only: the SDS, your local rules and your supervisor decide.
          </Text>
        </Notice>
      ) : null}
    </View>
  );
}

/** The numbers behind the answer, folded away until asked for. */
export function LayerDetails({ input, prediction: p }: { input: LayerInput; prediction: LayerPrediction }) {
  const [open, setOpen] = useState(false);
  const T = formatTemperatureC(input.temperatureC);
  return (
    <View style={styles.stack}>
      <Button
        label={open ? "Hide the numbers" : "Show the numbers and sources"}
        variant="secondary"
        onPress={() => setOpen((o) => !o)}
        testID="details-toggle"
      />
      {open ? (
        <Card testID="layer-details">
          <Text bold size="title">
            {`Densities at ${T}`}
          </Text>
          {p.organicParts.map((o, i) => (
            <Text key={`${o.key}-${i}`}>{`${o.name}, ${formatVolumeMl(o.volumeMl)}: ${formatDensity(o.densityGPerMl)}`}</Text>
          ))}
          {p.organicParts.length > 1 || (input.dissolvedSolidsG ?? 0) > 0 ? (
            <Text bold>{`Organic phase, ${formatVolumeMl(p.organicVolumeMl)}: ${formatDensity(p.organicDensityGPerMl)}`}</Text>
          ) : null}
          <Text>{`${p.aqueous.name}, ${formatPercent(p.aqueous.massFractionPct)} w/w, ${formatVolumeMl(input.aqueous.volumeMl)}: ${formatDensity(p.aqueousDensityGPerMl)}`}</Text>
          <Text bold size="title">
            Assumptions
          </Text>
          {p.assumptions.map((a) => (
            <Text key={a}>{`• ${a}`}</Text>
          ))}
          <Text bold size="title">
            Sources
          </Text>
          {p.sources.map((key) => (
            <Text key={key} size="caption">
              {`• ${sourceTitle(key).title}`}
            </Text>
          ))}
        </Card>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.md },
  layerRow: { flexDirection: "row", gap: space.md, alignItems: "stretch" },
  swatch: { width: 10, borderRadius: radii.sm },
  layerText: { flex: 1, gap: 2 },
  certainty: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.sm },
  grow: { flexGrow: 1, flexShrink: 1, flexBasis: 200 },
  badge: { borderWidth: 2, borderRadius: radii.pill, paddingHorizontal: space.md, paddingVertical: space.xs },
  drawing: { alignItems: "center" },
});
