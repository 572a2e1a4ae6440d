import { useRouter } from "expo-router";
import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { ApiError } from "../../hooks/api";
import { space } from "../../hooks/theme";
import { useDraft } from "../../hooks/use-draft";
import { useActiveGroup } from "../../hooks/use-me";
import { useCreatePlanMutation } from "../../hooks/use-plans";
import { formatDateTime } from "../cases/format";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Loading } from "../ui/states";
import { Text } from "../ui/text";
import { documentToSave, examplePlan, NEW_PLAN, type PlanDraft } from "./plan-draft";
import { usePlanEvaluation } from "./use-plan-evaluation";
import { PlanWorkbench } from "./plan-workbench";
import { SavedPlans } from "./saved-plans";

/** Where the new plan's draft is kept, per user (the bench card reads it too). */
export const newPlanDraftKey = (userId: string) => `plan.new.${userId}`;

/** /plan: build a work-up plan, see it computed as you type, save it for the group. */
export function PlanScreen() {
  const group = useActiveGroup();
  if (!group) {
    return (
      <Screen title="Plan a work-up" width="full">
        <Loading />
      </Screen>
    );
  }
  return <NewPlan userId={group.userId} groupName={group.name} />;
}

function NewPlan({ userId, groupName }: { userId: string; groupName: string }) {
  const router = useRouter();
  const draft = useDraft<PlanDraft>(newPlanDraftKey(userId), NEW_PLAN);
  const set = (next: (d: PlanDraft) => PlanDraft) => draft.set(next);
  const d = draft.value;
  const empty = d.components.length === 0 && d.washes.length === 0 && !d.solvent;
  const actions = (
    <>
      <Button label="Choose a solvent" variant="secondary" onPress={() => router.push((d.solvent ? `/plan/solvent-choice?for=${encodeURIComponent(d.solvent)}` : "/plan/solvent-choice") as never)} testID="plan-open-solvent-choice" />
      <Button label="Bench card" variant="secondary" onPress={() => router.push("/plan/print" as never)} testID="plan-open-card" />
    </>
  );
  const top = (
    <View style={styles.stack}>
      {draft.restoredAt ? (
        <Notice tone="info" title="Your unsaved plan is back" testID="plan-restored">
          <Text>Kept on this device since {formatDateTime(draft.restoredAt.toISOString())}.</Text>
          <Button label="Start over" variant="quiet" onPress={() => draft.clear()} testID="plan-start-over" />
        </Notice>
      ) : null}
      {empty ? (
        <Card testID="plan-empty">
          <Text bold size="title">
            Plan the washes before you pour
          </Text>
          <Text>Pick the solvent, list what the organic solution holds, then add the washes in order. The answer updates as you type and is kept on this device until you save it.</Text>
          <Button label="Start from the worked example" variant="secondary" onPress={() => draft.set(examplePlan())} testID="plan-load-example" />
        </Card>
      ) : null}
      <SavedPlans groupName={groupName} />
    </View>
  );
  return (
    <Screen title="Plan a work-up" subtitle="Acid–base washes, pass by pass" width="full" actions={actions}>
      <PlanWorkbench draft={d} set={set} top={top} bottom={<SaveNewPlan draft={d} set={set} onSaved={(id) => { draft.clear(); router.push(`/plan/${id}` as never); }} />} />
    </Screen>
  );
}

function SaveNewPlan({ draft, set, onSaved }: { draft: PlanDraft; set: (next: (d: PlanDraft) => PlanDraft) => void; onSaved: (id: string) => void }) {
  const create = useCreatePlanMutation();
  const [problem, setProblem] = useState<string | null>(null);
  const evaluation = usePlanEvaluation(draft).evaluation!;
  const doc = documentToSave(draft, evaluation);
  const save = () => {
    setProblem(null);
    if (!draft.title.trim()) return setProblem("Give the plan a title first.");
    if (!doc) return setProblem("Finish the plan first: the results must show before it can be saved.");
    create.mutate(
      { title: draft.title.trim(), notes: draft.notes, input: doc },
      {
        onSuccess: (saved) => onSaved(saved.id),
        onError: (e) => setProblem(e instanceof ApiError && e.fields ? Object.values(e.fields).join(" ") : (e as Error).message),
      },
    );
  };
  return (
    <Card testID="plan-save">
      <Text bold size="title" accessibilityRole="header">
        Save for the group
      </Text>
      <Field label="Title" value={draft.title} onChangeText={(title) => set((d) => ({ ...d, title }))} placeholder="e.g. Amide coupling work-up, batch 7" testID="plan-title" />
      <Field label="Notes" value={draft.notes} onChangeText={(notes) => set((d) => ({ ...d, notes }))} multiline placeholder="Anything the next person should know" testID="plan-notes" />
      {problem ? (
        <Notice tone="danger" testID="plan-save-error">
          {problem}
        </Notice>
      ) : null}
      <Button label="Save plan" onPress={save} busy={create.isPending} testID="plan-save-button" />
      <Text size="caption" tone="inkMuted">
        Everyone in the group can open it; you, the leads and the owner can change it.
      </Text>
    </Card>
  );
}

const styles = StyleSheet.create({ stack: { gap: space.lg } });
