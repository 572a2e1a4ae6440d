import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { ApiError } from "../../hooks/api";
import { colors, space } from "../../hooks/theme";
import { useAddAttemptMutation, usePatchAttemptMutation } from "../../hooks/use-cases";
import { useDraft } from "../../hooks/use-draft";
import type { AttemptOutcome, CaseAttempt } from "../../knowledge/contracts/cases";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { attemptBodyFromDraft, emptyAttemptDraft, type AttemptDraftValue, type FieldErrors } from "./case-draft";
import { ChoiceChips } from "./choice-chips";
import { formatDateTime, formatMinutes } from "./format";
import { OutcomePill } from "./pill";
import { OUTCOME, OUTCOME_CHOICES, REMEDY_CHOICES } from "./vocab";

const FIRST_REMEDIES = 8;

/** What was tried, in order, as a line of numbered steps. */
export function AttemptTimeline({ caseId, attempts, canEdit }: { caseId: string; attempts: CaseAttempt[]; canEdit: boolean }) {
  if (!attempts.length) {
    return (
      <Text tone="inkMuted" testID="attempts-empty">
        Nothing tried yet. Log each remedy as you try it: the next person with this emulsion starts from here.
      </Text>
    );
  }
  return (
    <View accessibilityRole="list" testID="attempts">
      {attempts.map((a, i) => (
        <AttemptItem key={a.id} caseId={caseId} attempt={a} last={i === attempts.length - 1} canEdit={canEdit} />
      ))}
    </View>
  );
}

function AttemptItem({ caseId, attempt: a, last, canEdit }: { caseId: string; attempt: CaseAttempt; last: boolean; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const tone = OUTCOME[a.outcome].tone;
  const dot = tone === "neutral" ? colors.inkMuted : colors[tone];
  const facts = [a.amount, a.minutes !== null ? formatMinutes(a.minutes) : null].filter(Boolean).join(" · ");
  return (
    <View style={styles.item} testID={`attempt-${a.position}`} accessibilityLabel={`Attempt ${a.position}: ${a.label}, ${OUTCOME[a.outcome].label}`}>
      <View style={styles.rail}>
        <View style={[styles.dot, { backgroundColor: dot }]}>
          <Text size="caption" bold tone="brandInk">
            {a.position}
          </Text>
        </View>
        {!last ? <View style={styles.line} /> : null}
      </View>
      <View style={styles.body}>
        <View style={styles.head}>
          <Text bold style={styles.grow}>
            {a.label}
          </Text>
          <OutcomePill outcome={a.outcome} testID={`attempt-${a.position}-outcome`} />
        </View>
        {facts ? <Text tone="inkMuted">{facts}</Text> : null}
        {a.description && a.remedyId ? <Text>{a.description}</Text> : null}
        {a.note ? <Text>{a.note}</Text> : null}
        <Text size="caption" tone="inkMuted">
          {a.authorName} · {formatDateTime(a.createdAt)}
          {a.updatedAt !== a.createdAt ? " · edited" : ""}
        </Text>
        {canEdit && !editing ? (
          <View style={styles.start}>
            <Button label="Change" variant="quiet" hint={`Change attempt ${a.position}`} onPress={() => setEditing(true)} testID={`attempt-${a.position}-edit`} />
          </View>
        ) : null}
        {editing ? <AttemptEdit caseId={caseId} attempt={a} onDone={() => setEditing(false)} /> : null}
      </View>
    </View>
  );
}

/** Correct an attempt: most often its outcome, once the band has had time. */
function AttemptEdit({ caseId, attempt, onDone }: { caseId: string; attempt: CaseAttempt; onDone: () => void }) {
  const patch = usePatchAttemptMutation(caseId);
  const [outcome, setOutcome] = useState<AttemptOutcome>(attempt.outcome);
  const [minutes, setMinutes] = useState(attempt.minutes !== null ? String(attempt.minutes) : "");
  const [note, setNote] = useState(attempt.note ?? "");
  const [error, setError] = useState<string | null>(null);
  const save = () => {
    const m = minutes.trim() === "" ? null : Number(minutes.replace(",", "."));
    if (m !== null && (!Number.isFinite(m) || m < 0)) {
      setError("Give the minutes as a number.");
      return;
    }
    setError(null);
    patch.mutate(
      { attemptId: attempt.id, body: { outcome, minutes: m, note: note.trim() || null } },
      { onSuccess: onDone, onError: (e) => setError(e.message) },
    );
  };
  return (
    <View style={styles.edit}>
      <ChoiceChips label="Outcome" choices={OUTCOME_CHOICES} value={outcome} onChange={(v) => v && setOutcome(v)} allowNone={false} testID={`attempt-${attempt.position}-set`} />
      <Field label="Minutes" value={minutes} onChangeText={setMinutes} inputMode="decimal" />
      <Field label="Note" value={note} onChangeText={setNote} multiline />
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <View style={styles.buttons}>
        <Button label="Save change" onPress={save} busy={patch.isPending} testID={`attempt-${attempt.position}-save`} />
        <Button label="Cancel" variant="quiet" onPress={onDone} />
      </View>
    </View>
  );
}

/** Add one attempt in one step. The draft survives a locked phone until it is saved. */
export function AddAttempt({ caseId, draftKey, nextPosition }: { caseId: string; draftKey: string; nextPosition: number }) {
  const draft = useDraft<AttemptDraftValue>(draftKey, emptyAttemptDraft);
  const d = draft.value;
  const set = draft.set;
  const add = useAddAttemptMutation(caseId);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [allRemedies, setAllRemedies] = useState(false);
  const chosenBeyond = REMEDY_CHOICES.findIndex((r) => r.value === d.remedyId) >= FIRST_REMEDIES;
  const remedies = allRemedies || chosenBeyond ? REMEDY_CHOICES : REMEDY_CHOICES.slice(0, FIRST_REMEDIES);

  const submit = () => {
    const { body, errors: found } = attemptBodyFromDraft(d);
    setErrors(found);
    if (!body) return;
    add.mutate(body, {
      onSuccess: () => {
        draft.clear();
        setAllRemedies(false);
      },
      onError: (e) => {
        if (e instanceof ApiError && e.fields) setErrors(e.fields);
      },
    });
  };

  return (
    <View style={styles.add} testID="add-attempt">
      <Text size="title" bold accessibilityRole="header">
        Add attempt {nextPosition}
      </Text>
      {draft.restoredAt ? (
        <Text size="caption" tone="inkMuted" testID="attempt-draft-restored">
          Unsaved attempt kept from earlier.
        </Text>
      ) : null}
      <ChoiceChips label="Remedy" choices={remedies} value={d.remedyId} onChange={(v) => set((x) => ({ ...x, remedyId: v }))} testID="remedy" />
      {!allRemedies && !chosenBeyond ? (
        <Button label={`All ${REMEDY_CHOICES.length} remedies`} variant="quiet" onPress={() => setAllRemedies(true)} testID="remedy-all" />
      ) : null}
      {errors.remedyId ? (
        <Text tone="danger" size="caption">
          {errors.remedyId}
        </Text>
      ) : null}
      <Field
        label={d.remedyId ? "Details (optional)" : "Or describe what you tried"}
        value={d.description}
        onChangeText={(t) => set((x) => ({ ...x, description: t }))}
        error={errors.description}
        testID="attempt-description"
      />
      <View style={styles.pair}>
        <View style={styles.grow}>
          <Field label="Amount" value={d.amount} onChangeText={(t) => set((x) => ({ ...x, amount: t }))} placeholder="20 mL, 3 g" error={errors.amount} testID="attempt-amount" />
        </View>
        <View style={styles.grow}>
          <Field label="Minutes" value={d.minutes} onChangeText={(t) => set((x) => ({ ...x, minutes: t }))} inputMode="decimal" placeholder="10" error={errors.minutes} testID="attempt-minutes" />
        </View>
      </View>
      <ChoiceChips label="Outcome" choices={OUTCOME_CHOICES} value={d.outcome} onChange={(v) => set((x) => ({ ...x, outcome: v }))} testID="outcome" />
      {errors.outcome ? (
        <Text tone="danger" size="caption">
          {errors.outcome}
        </Text>
      ) : null}
      <Field label="Note" value={d.note} onChangeText={(t) => set((x) => ({ ...x, note: t }))} multiline error={errors.note} testID="attempt-note" />
      {add.isError && !(add.error instanceof ApiError && add.error.fields) ? (
        <Notice tone="danger" title="Not saved yet" testID="attempt-save-error">
          {add.error instanceof ApiError ? add.error.message : "The attempt did not reach the server; it is kept here. Try again."}
        </Notice>
      ) : null}
      <Button label="Add attempt" onPress={submit} busy={add.isPending} testID="attempt-save" />
    </View>
  );
}

const styles = StyleSheet.create({
  item: { flexDirection: "row", gap: space.md },
  rail: { alignItems: "center", width: 32 },
  dot: { width: 32, height: 32, borderRadius: 16, alignItems: "center", justifyContent: "center" },
  line: { flex: 1, width: 3, backgroundColor: colors.line, marginVertical: space.xs },
  body: { flex: 1, gap: space.xs, paddingBottom: space.lg },
  head: { flexDirection: "row", gap: space.sm, alignItems: "flex-start", flexWrap: "wrap" },
  grow: { flexGrow: 1, flexShrink: 1, flexBasis: 120 },
  edit: { gap: space.sm, paddingTop: space.sm },
  start: { alignSelf: "flex-start", marginLeft: -space.lg },
  buttons: { flexDirection: "row", gap: space.sm, flexWrap: "wrap" },
  add: { gap: space.md },
  pair: { flexDirection: "row", gap: space.md, flexWrap: "wrap" },
});
