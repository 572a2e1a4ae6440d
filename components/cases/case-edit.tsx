import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { ApiError } from "../../hooks/api";
import { space } from "../../hooks/theme";
import { usePatchCaseMutation } from "../../hooks/use-cases";
import type { CaseDetail, CaseStatus } from "../../knowledge/contracts/cases";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { ChoiceChips } from "./choice-chips";
import { STATUS_CHOICES } from "./vocab";

function numberOrUndefined(text: string): number | undefined | "bad" {
  const t = text.trim().replace(",", ".").replace(/\s*(g|%)$/i, "");
  if (t === "") return undefined;
  const n = Number(t);
  return Number.isFinite(n) && n >= 0 ? n : "bad";
}

/** Status, final outcome and recovery: what the author or a lead closes a case with. */
export function CaseEdit({ detail, onDone }: { detail: CaseDetail; onDone: () => void }) {
  const patch = usePatchCaseMutation(detail.id);
  const [status, setStatus] = useState<CaseStatus>(detail.status);
  const [finalOutcome, setFinalOutcome] = useState(detail.finalOutcome ?? "");
  const [massG, setMassG] = useState(detail.recovery?.massG !== undefined ? String(detail.recovery.massG) : "");
  const [percent, setPercent] = useState(detail.recovery?.percent !== undefined ? String(detail.recovery.percent) : "");
  const [errors, setErrors] = useState<Record<string, string>>({});

  const save = () => {
    const m = numberOrUndefined(massG);
    const p = numberOrUndefined(percent);
    const found: Record<string, string> = {};
    if (m === "bad") found["recovery.massG"] = "Give the mass in g.";
    if (p === "bad") found["recovery.percent"] = "Give the recovery in %.";
    setErrors(found);
    if (Object.keys(found).length) return;
    const recovery = m === undefined && p === undefined ? null : { ...(m !== undefined ? { massG: m as number } : {}), ...(p !== undefined ? { percent: p as number } : {}) };
    patch.mutate(
      { status, finalOutcome: finalOutcome.trim() || null, recovery },
      {
        onSuccess: onDone,
        onError: (e) => {
          if (e instanceof ApiError && e.fields) setErrors(e.fields);
        },
      },
    );
  };

  return (
    <View style={styles.wrap} testID="case-edit">
      <ChoiceChips label="Status" choices={STATUS_CHOICES} value={status} onChange={(v) => v && setStatus(v)} allowNone={false} testID="status" />
      <Field
        label="Final outcome"
        value={finalOutcome}
        onChangeText={setFinalOutcome}
        multiline
        placeholder="e.g. both layers filtered through diatomaceous earth, product in the organic"
        error={errors.finalOutcome}
        testID="final-outcome"
      />
      <View style={styles.pair}>
        <View style={styles.grow}>
          <Field label="Recovered (g)" value={massG} onChangeText={setMassG} inputMode="decimal" error={errors["recovery.massG"]} testID="recovery-g" />
        </View>
        <View style={styles.grow}>
          <Field label="Recovered (%)" value={percent} onChangeText={setPercent} inputMode="decimal" error={errors["recovery.percent"]} testID="recovery-pct" />
        </View>
      </View>
      {patch.isError && !(patch.error instanceof ApiError && patch.error.fields) ? (
        <Notice tone="danger" title="Not saved">
          {patch.error.message}
        </Notice>
      ) : null}
      <View style={styles.pair}>
        <Button label="Save" onPress={save} busy={patch.isPending} testID="case-edit-save" />
        <Button label="Cancel" variant="quiet" onPress={onDone} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  pair: { flexDirection: "row", gap: space.md, flexWrap: "wrap" },
  grow: { flexGrow: 1, flexBasis: 140 },
});
