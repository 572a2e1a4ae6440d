import { useLocalSearchParams, useRouter } from "expo-router";
import { useMemo, useState } from "react";
import { StyleSheet, View } from "react-native";
import type { SavedPlan } from "../../knowledge/contracts/plans";
import { ApiError } from "../../hooks/api";
import { space } from "../../hooks/theme";
import { useDraft, writeDraft } from "../../hooks/use-draft";
import { useActiveGroup } from "../../hooks/use-me";
import { useDeletePlanMutation, usePatchPlanMutation, usePlanQuery } from "../../hooks/use-plans";
import { formatDateTime } from "../cases/format";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { documentToSave, draftFromDocument, type PlanDraft } from "./plan-draft";
import { usePlanEvaluation } from "./use-plan-evaluation";
import { EvaporationReadOnly, FunnelPanel, PassesPanel, RecoveryReadOnly } from "./plan-panels";
import { PhSection, PlanAnswer, PlanBasis, PlanWarnings, StepTable } from "./plan-results";
import { newPlanDraftKey } from "./plan-screen";
import { PlanWorkbench } from "./plan-workbench";

const editDraftKey = (userId: string, planId: string) => `plan.edit.${userId}.${planId}`;

/** /plan/:id — a saved plan: its author and the leads edit it; everyone else reads it and may copy it. */
export function SavedPlanScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const q = usePlanQuery(id);
  const group = useActiveGroup();
  const router = useRouter();
  const back = <Button label="All plans" variant="secondary" onPress={() => router.navigate("/plan" as never)} testID="plan-back" />;
  if (q.isPending || !group) {
    return (
      <Screen title="Plan" actions={back} width="full">
        <Loading label="Loading the plan…" />
      </Screen>
    );
  }
  if (q.isError) {
    const missing = q.error instanceof ApiError && q.error.status === 404;
    return (
      <Screen title="Plan" actions={back} width="full">
        {missing ? <Empty title="No such plan in your group" body="It may belong to another group, have been deleted, or the link is mistyped." /> : <ErrorState error={q.error} onRetry={() => q.refetch()} />}
      </Screen>
    );
  }
  const plan = q.data;
  const byline = `By ${plan.author.name}${plan.updatedBy ? `, changed by ${plan.updatedBy.name}` : ""}, ${formatDateTime(plan.updatedAt)}`;
  const actions = (
    <>
      {back}
      <Button label="Bench card" variant="secondary" onPress={() => router.push(`/plan/print?id=${encodeURIComponent(plan.id)}` as never)} testID="plan-open-card" />
    </>
  );
  return (
    <Screen title={plan.title} subtitle={byline} actions={actions} width="full">
      {plan.canEdit ? <EditPlan key={plan.id} plan={plan} userId={group.userId} /> : <ReadPlan plan={plan} userId={group.userId} />}
    </Screen>
  );
}

function EditPlan({ plan, userId }: { plan: SavedPlan; userId: string }) {
  const router = useRouter();
  const initial = useMemo(() => () => draftFromDocument(plan.input, plan.title, plan.notes), [plan]);
  const draft = useDraft<PlanDraft>(editDraftKey(userId, plan.id), initial);
  const set = (next: (d: PlanDraft) => PlanDraft) => draft.set(next);
  const patch = usePatchPlanMutation(plan.id);
  const remove = useDeletePlanMutation(plan.id);
  const [confirming, setConfirming] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const evaluation = usePlanEvaluation(draft.value).evaluation!;
  const staleDraft = draft.restoredAt && draft.restoredAt.getTime() < new Date(plan.updatedAt).getTime();

  const save = () => {
    setProblem(null);
    setSaved(false);
    const doc = documentToSave(draft.value, evaluation);
    if (!draft.value.title.trim()) return setProblem("The plan needs a title.");
    if (!doc) return setProblem("Finish the plan first: the results must show before it can be saved.");
    patch.mutate(
      { title: draft.value.title.trim(), notes: draft.value.notes, input: doc },
      {
        onSuccess: () => {
          draft.clear();
          setSaved(true);
        },
        onError: (e) => setProblem(e instanceof ApiError && e.fields ? Object.values(e.fields).join(" ") : (e as Error).message),
      },
    );
  };

  const top = draft.restoredAt ? (
    <Notice tone={staleDraft ? "caution" : "info"} title={staleDraft ? "The saved plan changed after your unsaved edits" : "Your unsaved edits are back"} testID="plan-restored">
      <Text>
        Edits kept on this device since {formatDateTime(draft.restoredAt.toISOString())}
        {staleDraft ? `; the group's copy was changed ${formatDateTime(plan.updatedAt)}.` : "."}
      </Text>
      <Button label="Discard my edits" variant="quiet" onPress={() => draft.clear()} testID="plan-discard-edits" />
    </Notice>
  ) : undefined;

  const bottom = (
    <Card testID="plan-save">
      <Text bold size="title" accessibilityRole="header">
        Save changes
      </Text>
      <Field label="Title" value={draft.value.title} onChangeText={(title) => set((d) => ({ ...d, title }))} testID="plan-title" />
      <Field label="Notes" value={draft.value.notes} onChangeText={(notes) => set((d) => ({ ...d, notes }))} multiline testID="plan-notes" />
      {problem ? (
        <Notice tone="danger" testID="plan-save-error">
          {problem}
        </Notice>
      ) : null}
      {saved ? (
        <Notice tone="good" testID="plan-saved-notice">
          Saved for the group.
        </Notice>
      ) : null}
      <View style={styles.row}>
        <Button label="Save changes" onPress={save} busy={patch.isPending} testID="plan-save-button" />
        {confirming ? (
          <>
            <Button
              label="Delete for everyone"
              variant="danger"
              busy={remove.isPending}
              onPress={() =>
                remove.mutate(undefined, {
                  onSuccess: () => {
                    draft.clear();
                    router.navigate("/plan" as never);
                  },
                  onError: (e) => setProblem((e as Error).message),
                })
              }
              testID="plan-delete-confirm"
            />
            <Button label="Keep it" variant="quiet" onPress={() => setConfirming(false)} />
          </>
        ) : (
          <Button label="Delete plan" variant="danger" onPress={() => setConfirming(true)} testID="plan-delete" />
        )}
      </View>
    </Card>
  );
  return <PlanWorkbench draft={draft.value} set={set} top={top} bottom={bottom} />;
}

/** Someone else's plan: the results, its notes, and a copy to start from. */
function ReadPlan({ plan, userId }: { plan: SavedPlan; userId: string }) {
  const router = useRouter();
  const draft = useMemo(() => draftFromDocument(plan.input, plan.title, plan.notes), [plan]);
  const computed = usePlanEvaluation(draft);
  const evaluation = computed.evaluation!;
  const recovery = computed.recovery!;
  const evaporation = computed.evaporation!;
  return (
    <View style={styles.stack}>
      <Notice tone="info" title="Shared by the group" testID="plan-read-only">
        <Text>Only its author or a lead can change it. Copy it to adjust it for your own run.</Text>
        <Button
          label="Copy into my new plan"
          variant="secondary"
          onPress={() => {
            writeDraft(newPlanDraftKey(userId), { ...draft, title: `${plan.title} (copy)` });
            router.navigate("/plan" as never);
          }}
          testID="plan-copy"
        />
      </Notice>
      {plan.notes ? (
        <Card>
          <Text bold>Notes</Text>
          <Text>{plan.notes}</Text>
        </Card>
      ) : null}
      {evaluation.status === "ok" ? (
        <>
          <PlanAnswer doc={evaluation.doc} result={evaluation.result} />
          <StepTable doc={evaluation.doc} result={evaluation.result} />
          <PlanWarnings result={evaluation.result} />
          <PhSection doc={evaluation.doc} result={evaluation.result} />
          <PassesPanel doc={evaluation.doc} result={evaluation.result} />
          <RecoveryReadOnly outcome={recovery} />
          <FunnelPanel result={evaluation.result} />
          <EvaporationReadOnly outcome={evaporation} solvent={evaluation.doc.organic.solvent} />
          <PlanBasis result={evaluation.result} />
        </>
      ) : (
        <Notice tone="caution" title="This plan no longer computes">
          {Object.values(evaluation.errors).join(" ") || "The tables changed since it was saved."}
        </Notice>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
});
