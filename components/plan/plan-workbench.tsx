import { StyleSheet, View } from "react-native";
import { useLayout } from "../../hooks/breakpoints";
import { space } from "../../hooks/theme";
import { Card } from "../ui/card";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { PlanBuilder } from "./plan-builder";
import { type PlanDraft } from "./plan-draft";
import { usePlanEvaluation } from "./use-plan-evaluation";
import { EvaporationPanel, FunnelPanel, PassesPanel, RecoveryPanel } from "./plan-panels";
import { PhSection, PlanAnswer, PlanBasis, PlanWarnings, StepTable } from "./plan-results";

export interface WorkbenchProps {
  draft: PlanDraft;
  set: (next: (d: PlanDraft) => PlanDraft) => void;
  /** above the builder: saved plans, restore notices */
  top?: React.ReactNode;
  /** under the results: save, share, print */
  bottom?: React.ReactNode;
}

/**
 * The plan builder beside its live results (computed here, in the browser): inputs on the left
 * and the answer on the right on a wide screen; inputs first, then the answer, on a phone.
 */
export function PlanWorkbench({ draft, set, top, bottom }: WorkbenchProps) {
  const wide = useLayout() === "wide";
  const computed = usePlanEvaluation(draft);
  const evaluation = computed.evaluation!;
  const recovery = computed.recovery!;
  const evaporation = computed.evaporation!;
  const errors = evaluation.errors;

  const results =
    evaluation.status === "ok" ? (
      <View style={styles.stack} testID="plan-results">
        <PlanAnswer doc={evaluation.doc} result={evaluation.result} />
        <StepTable doc={evaluation.doc} result={evaluation.result} />
        <PlanWarnings result={evaluation.result} />
        <PhSection doc={evaluation.doc} result={evaluation.result} />
        {evaluation.doc.components.length > 0 ? <PassesPanel doc={evaluation.doc} result={evaluation.result} /> : null}
        <RecoveryPanel draft={draft} set={set} outcome={recovery} />
        <FunnelPanel result={evaluation.result} />
        <EvaporationPanel draft={draft} set={set} outcome={evaporation} solvent={evaluation.doc.organic.solvent} />
        <PlanBasis result={evaluation.result} />
      </View>
    ) : (
      <Card testID="plan-pending">
        <Text bold size="title">
          The plan appears here as you fill it in
        </Text>
        {evaluation.status === "incomplete" ? (
          <Text tone="inkMuted">Still needed: {evaluation.missing.slice(0, 4).join(", ")}{evaluation.missing.length > 4 ? "…" : "."}</Text>
        ) : (
          <Notice tone="caution" title="Something needs a second look" testID="plan-invalid">
            {Object.values(evaluation.errors).slice(0, 3).join(" ")}
          </Notice>
        )}
      </Card>
    );

  const builder = <PlanBuilder draft={draft} set={set} errors={errors} />;
  if (wide) {
    return (
      <View style={styles.stack}>
        {top}
        <View style={styles.columns}>
          <View style={styles.inputs}>{builder}</View>
          <View style={styles.outputs}>
            {results}
            {bottom}
          </View>
        </View>
      </View>
    );
  }
  return (
    <View style={styles.stack}>
      {top}
      {builder}
      {results}
      {bottom}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  columns: { flexDirection: "row", alignItems: "flex-start", gap: space.lg },
  inputs: { flex: 1, minWidth: 340, maxWidth: 520 },
  outputs: { flex: 1.3, minWidth: 0, gap: space.lg },
});
