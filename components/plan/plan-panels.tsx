import { useState } from "react";
import { StyleSheet, View } from "react-native";
import type { PlanDocument, RecoveryOutcome } from "../../knowledge/contracts/plans";
import {
  compareOneVersusSplit,
  EXOTHERM_CAUTION,
  fractionLeftCurve,
  MAX_FILL_FRACTION,
  passesForRecovery,
  RULE_STEP_C,
  VENTING_CAUTION,
  type EvaporationSettings,
  type PlanResult,
} from "../../knowledge/plan";
import { space } from "../../hooks/theme";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { formatVolumeMl } from "../ui/format";
import { Notice } from "../ui/notice";
import { QuantityField } from "../ui/quantity-field";
import { SolutePicker } from "../ui/solute-picker";
import { Text } from "../ui/text";
import { PassesCurve } from "./charts";
import type { PanelOutcome, PlanDraft } from "./plan-draft";
import { formatDegrees, formatMbar, formatMmol, formatPh, formatShare, solventLabel, washLabel } from "./plan-format";
import { DEFER_LINE } from "./plan-view";

// ── passes for a target recovery ─────────────────────────────────────────────

const TARGETS = ["90", "95", "99", "99.9"] as const;
/** D below this counts as "the wash takes it all": 1/D would overflow the formula's checks. */
const TINY_D = 1e-12;

/** How many passes of a wash reach a target recovery, one big portion against several small ones, and the curve. */
export function PassesPanel({ doc, result }: { doc: PlanDocument; result: PlanResult }) {
  const [ci, setCi] = useState(0);
  const [wi, setWi] = useState(0);
  const [target, setTarget] = useState<(typeof TARGETS)[number]>("99");
  const c = doc.components[Math.min(ci, doc.components.length - 1)];
  const w = doc.washes[Math.min(wi, doc.washes.length - 1)];
  const first = result.steps.find((s) => s.wash === Math.min(wi, doc.washes.length - 1));
  if (!c || !w || !first) return null;
  const cIndex = doc.components.indexOf(c);
  const D = first.components[cIndex]?.distributionRatio ?? 0;
  // fresh aqueous portions extracting the organic layer: concentration ratio portion ÷ layer = 1/D
  const extraction = { distributionRatio: 1 / Math.max(D, TINY_D), sourceVolumeMl: doc.organic.volumeMl, portionVolumeMl: w.volumeMl };
  const goal = Number(target) / 100;
  const need = passesForRecovery(extraction, goal);
  const planned = w.repeats ?? 1;
  const portions = Math.max(planned, 3);
  const compare = compareOneVersusSplit(extraction.distributionRatio, doc.organic.volumeMl, w.volumeMl * portions, portions);
  const maxPasses = Math.min(10, Math.max(4, planned, need.passes ?? 0));
  const curve = fractionLeftCurve(extraction, maxPasses);
  const verdict =
    need.passes === null
      ? `${c.name} stays: ${washLabel(w)} at pH ${formatPh(first.aqueousPh)} would need more than 50 passes to take ${target} % of it.`
      : `${need.passes} pass${need.passes === 1 ? "" : "es"} of ${formatVolumeMl(w.volumeMl)} take${need.passes === 1 ? "s" : ""} ${formatShare(need.recovery ?? 0)} of ${c.name}; the plan makes ${planned}.`;
  return (
    <Card testID="plan-passes">
      <Text bold size="title" accessibilityRole="header">
        Passes for a target
      </Text>
      <Chips label="Component" showLabel options={doc.components.map((x, i) => ({ value: String(i), label: x.name }))} selected={String(cIndex)} onSelect={(v) => setCi(Number(v))} testID="plan-passes-component" />
      <Chips label="Wash" showLabel options={doc.washes.map((x, i) => ({ value: String(i), label: `W${i + 1} ${washLabel(x)}` }))} selected={String(doc.washes.indexOf(w))} onSelect={(v) => setWi(Number(v))} testID="plan-passes-wash" />
      <Chips label="Take out at least" showLabel options={TARGETS.map((t) => ({ value: t, label: `${t} %` }))} selected={target} onSelect={setTarget} testID="plan-passes-target" />
      <Text bold size="title" testID="plan-passes-verdict">
        {verdict}
      </Text>
      <PassesCurve
        points={curve}
        targetLeft={1 - goal}
        planned={planned}
        description={`Share of ${c.name} left in the organic layer after 0 to ${maxPasses} passes of ${formatVolumeMl(w.volumeMl)} ${washLabel(w)}: ${curve
          .map((p) => `${p.pass}: ${formatShare(p.fractionLeft)}`)
          .join(", ")}.`}
        testID="plan-passes-curve"
      />
      <Text>
        One {formatVolumeMl(w.volumeMl * portions)} portion takes {formatShare(compare.singleRecovery)}; {portions} portions of {formatVolumeMl(w.volumeMl)} take {formatShare(compare.splitRecovery)}.
      </Text>
      <Text size="caption" tone="inkMuted">
        Multiple-extraction formula (left after n passes = (V_org / (V_org + V_aq/D))ⁿ) with D = {D < 0.001 ? D.toExponential(1) : D.toPrecision(3)} at the first pass's pH {formatPh(first.aqueousPh)}, taken as constant.
      </Text>
    </Card>
  );
}

// ── recovery from an extract ─────────────────────────────────────────────────

const STOCK_PICKS = ["1 M", "2 M", "6 M"] as const;

export interface RecoveryPanelProps {
  draft: PlanDraft;
  set: (next: (d: PlanDraft) => PlanDraft) => void;
  outcome: PanelOutcome<RecoveryOutcome>;
}

/** The saved recovery, answer only (someone else's plan). */
export function RecoveryReadOnly({ outcome }: { outcome: PanelOutcome<RecoveryOutcome> }) {
  if (outcome.status === "off") return null;
  return (
    <Card testID="plan-recovery">
      <Text bold size="title" accessibilityRole="header">
        Recover from an extract
      </Text>
      {outcome.status === "ok" ? <Text tone="inkMuted">{outcome.value.component}, from the wash {outcome.value.wash + 1} extracts</Text> : null}
      <RecoveryAnswer outcome={outcome} />
    </Card>
  );
}

/** Get an acid or base back from its extract: stock and volume, gas, heat, each with its caution. */
export function RecoveryPanel({ draft, set, outcome }: RecoveryPanelProps) {
  const ionisable = draft.components.filter((c) => c.kind !== "neutral" && c.name.trim());
  const r = draft.recovery;
  const chosen = draft.components.find((c) => c.id === r.component);
  return (
    <Card testID="plan-recovery">
      <Text bold size="title" accessibilityRole="header">
        Recover from an extract
      </Text>
      {ionisable.length === 0 ? (
        <Text tone="inkMuted">Add an acid or a base to plan getting it back from its extract.</Text>
      ) : (
        <>
          <Chips
            label="Component to recover"
            showLabel
            options={[{ value: "", label: "None" }, ...ionisable.map((c) => ({ value: c.id, label: c.name }))]}
            selected={r.component}
            onSelect={(component) =>
              set((d) => {
                const c = d.components.find((x) => x.id === component);
                // the usual stock for the direction, until the chemist picks another
                const reagent = d.recovery.reagent ?? (c ? (c.kind === "acid" ? "hydrochloric-acid" : "sodium-hydroxide") : null);
                const reagentConcentration = d.recovery.reagentConcentration || (c ? (c.kind === "acid" ? "6 M" : "2 M") : "");
                return { ...d, recovery: { ...d.recovery, component, reagent, reagentConcentration } };
              })
            }
            testID="plan-recovery-component"
          />
          {chosen ? (
            <>
              <Chips
                label="From the extracts of"
                showLabel
                options={[{ value: "auto", label: "The wash that took most" }, ...draft.washes.map((_w, i) => ({ value: String(i), label: `Wash ${i + 1}` }))]}
                selected={String(r.wash)}
                onSelect={(v) => set((d) => ({ ...d, recovery: { ...d.recovery, wash: v === "auto" ? "auto" : Number(v) } }))}
                testID="plan-recovery-wash"
              />
              <SolutePicker
                label={chosen.kind === "acid" ? "Acid stock to add" : "Base stock to add"}
                value={r.reagent}
                onChange={(reagent, c) => set((d) => ({ ...d, recovery: { ...d.recovery, reagent, ...(c ? { reagentConcentration: c } : {}) } }))}
                testID="plan-recovery-reagent"
              />
              <QuantityField
                label="Stock concentration"
                kind="concentration"
                text={r.reagentConcentration}
                onChangeText={(reagentConcentration) => set((d) => ({ ...d, recovery: { ...d.recovery, reagentConcentration } }))}
                picks={STOCK_PICKS}
                testID="plan-recovery-concentration"
              />
              <Field
                label="Target pH"
                value={r.targetPh}
                onChangeText={(targetPh) => set((d) => ({ ...d, recovery: { ...d.recovery, targetPh } }))}
                placeholder={chosen.kind === "acid" ? "pKa − 2 unless you say" : "pKa + 2 unless you say"}
                keyboardType="numbers-and-punctuation"
                help="Two units past the pKa leaves about 1 % ionised."
                testID="plan-recovery-ph"
              />
              <RecoveryAnswer outcome={outcome} />
            </>
          ) : null}
        </>
      )}
    </Card>
  );
}

function RecoveryAnswer({ outcome }: { outcome: PanelOutcome<RecoveryOutcome> }) {
  if (outcome.status === "off") return null;
  if (outcome.status === "incomplete") return <Text tone="inkMuted">{outcome.message}</Text>;
  if (outcome.status === "error")
    return (
      <Notice tone="danger" title="Cannot work this out">
        {outcome.message}
      </Notice>
    );
  const v = outcome.value;
  const neutral = v.componentsNeutralFraction.find((c) => c.name === v.component)?.fractionNeutral ?? 0;
  return (
    <View style={styles.answer} testID="plan-recovery-answer">
      <Text bold size="title">
        Add about {formatVolumeMl(v.reagentVolumeMl)} of stock ({formatMmol(v.reagentMmol)})
      </Text>
      <Text>
        Brings the {formatVolumeMl(v.extractVolumeMl)} wash {v.wash + 1} extract from pH {formatPh(v.startPh)} to {formatPh(v.targetPh)}: {formatShare(neutral)} of {v.component} neutral, ready to extract back
        into fresh solvent. Total then {formatVolumeMl(v.finalVolumeMl)}.
      </Text>
      {v.co2Mmol > 0.01 ? (
        <Notice tone="caution" title={`About ${formatVolumeMl(v.co2Ml)} of CO2`} testID="plan-recovery-co2">
          {VENTING_CAUTION}
        </Notice>
      ) : null}
      {v.temperatureRiseK >= 1 ? (
        <Notice tone="caution" title={`Warms by about ${Math.round(v.temperatureRiseK)} °C`} testID="plan-recovery-heat">
          {EXOTHERM_CAUTION}
        </Notice>
      ) : null}
      {v.warnings
        .filter((w) => w.code !== "co2-gas" && w.code !== "exotherm")
        .map((w) => (
          <Notice key={w.code} tone="caution">
            {w.message}
          </Notice>
        ))}
    </View>
  );
}

// ── funnel ───────────────────────────────────────────────────────────────────

export function FunnelPanel({ result }: { result: PlanResult }) {
  const f = result.funnel;
  const most = Math.max(...result.steps.map((s) => s.totalVolumeMl));
  return (
    <Card testID="plan-funnel">
      <Text bold size="title" accessibilityRole="header">
        Funnel
      </Text>
      <Text bold size="answer" testID="plan-funnel-size">
        {formatVolumeMl(f.funnelMl)}
      </Text>
      <Text>
        {f.batches > 1
          ? `In ${f.batches} batches of about ${formatVolumeMl(f.batchVolumeMl)}, each ${Math.round(f.fillFraction * 100)} % full.`
          : `The most liquid at once is ${formatVolumeMl(most)}: ${Math.round(f.fillFraction * 100)} % full, within the ${Math.round(MAX_FILL_FRACTION * 100)} % that leaves room to shake (common practice).`}
      </Text>
      {f.warnings.map((w) => (
        <Notice key={w.code} tone="caution">
          {w.message}
        </Notice>
      ))}
    </Card>
  );
}

// ── rotary evaporation ───────────────────────────────────────────────────────

export interface EvaporationPanelProps {
  draft: PlanDraft;
  set: (next: (d: PlanDraft) => PlanDraft) => void;
  outcome: PanelOutcome<EvaporationSettings>;
  solvent: string;
}

/** The saved evaporation setting, answer only (someone else's plan). */
export function EvaporationReadOnly({ outcome, solvent }: { outcome: PanelOutcome<EvaporationSettings>; solvent: string }) {
  return (
    <Card testID="plan-evaporation">
      <Text bold size="title" accessibilityRole="header">
        Strip the solvent
      </Text>
      <EvaporationAnswer outcome={outcome} solvent={solvent} />
    </Card>
  );
}

export function EvaporationPanel({ draft, set, outcome, solvent }: EvaporationPanelProps) {
  const e = draft.evaporation;
  return (
    <Card testID="plan-evaporation">
      <Text bold size="title" accessibilityRole="header">
        Strip the solvent
      </Text>
      <Chips
        label="Work out"
        showLabel
        options={[
          { value: "vapour", label: "Pressure for a vapour temperature" },
          { value: "pressure", label: "Boiling point at a pressure" },
        ]}
        selected={e.mode}
        onSelect={(mode) => set((d) => ({ ...d, evaporation: { ...d.evaporation, mode } }))}
        testID="plan-evaporation-mode"
      />
      {e.mode === "vapour" ? (
        <QuantityField
          label="Vapour temperature"
          kind="temperature"
          text={e.vapour}
          onChangeText={(vapour) => set((d) => ({ ...d, evaporation: { ...d.evaporation, vapour } }))}
          picks={["20 °C", "25 °C", "30 °C", "40 °C"]}
          testID="plan-evaporation-vapour"
        />
      ) : (
        <Field
          label="Pressure (mbar)"
          value={e.pressure}
          onChangeText={(pressure) => set((d) => ({ ...d, evaporation: { ...d.evaporation, pressure } }))}
          keyboardType="decimal-pad"
          testID="plan-evaporation-pressure"
        />
      )}
      <EvaporationAnswer outcome={outcome} solvent={solvent} />
    </Card>
  );
}

function EvaporationAnswer({ outcome, solvent }: { outcome: PanelOutcome<EvaporationSettings>; solvent: string }) {
  if (outcome.status === "off") return null;
  if (outcome.status === "incomplete") return <Text tone="inkMuted">{outcome.message}</Text>;
  if (outcome.status === "error")
    return (
      <Notice tone="caution" title={`No setting for ${solventLabel(solvent)}`} testID="plan-evaporation-error">
        {outcome.message}
      </Notice>
    );
  const v = outcome.value;
  return (
    <View style={styles.answer} testID="plan-evaporation-answer">
      <Text bold size="title">
        {formatMbar(v.pressureMbar)}: {v.solventName} boils at {formatDegrees(v.boilingPointC)}
      </Text>
      <Text>
        Bath {formatDegrees(v.bathC)}, condenser at most {formatDegrees(v.condenserMaxC)} (the {RULE_STEP_C}-degree rule, common practice). At 1 atm it boils at {formatDegrees(v.normalBoilingPointC)}.
      </Text>
      {v.cautions.map((c) => (
        <Notice key={c.code} tone="caution">
          {c.message}
        </Notice>
      ))}
      {v.cautions.length ? <Text size="caption">{DEFER_LINE}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  answer: { gap: space.sm },
});
