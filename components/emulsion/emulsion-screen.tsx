import { useGroupReference } from "../../hooks/use-group-reference";
import { useRouter } from "expo-router";
import { useMemo, useState } from "react";
import { StyleSheet, View } from "react-native";
import type { TroubleshootResponse } from "../../knowledge/contracts/emulsion";
import { authClient } from "../../hooks/auth-client";
import { useLayout } from "../../hooks/breakpoints";
import { caseStartHref, type CasePrefill } from "../../hooks/case-prefill";
import { space } from "../../hooks/theme";
import { useDraft } from "../../hooks/use-draft";
import { useTroubleshootQuery } from "../../hooks/use-emulsion";
import { useActiveGroup } from "../../hooks/use-me";
import { Button } from "../ui/button";
import { Empty, Loading } from "../ui/states";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { BLANK_ANSWERS, buildRequest, computeLocally, rememberSystem, withSystem, type EmulsionAnswers, type StartingSystem } from "./answers";
import { FunnelFields } from "./funnel-fields";
import { KnownFields, SeenFields } from "./question-fields";
import { EmulsionResults, type Provenance } from "./results";
import { emulsionRecentKey, labelOf, startingSystems } from "./starts";

type Stage = "questions" | "answer";

/** What a new case starts from: the system and what was seen, and the reagents as tags. */
function prefillOf(system: StartingSystem, a: EmulsionAnswers): CasePrefill {
  const seen = a.seen.filter((f) => f !== "viscous" && f !== "afterSeparation");
  return {
    organic: system.organic,
    aqueous: system.aqueous,
    ...(system.temperatureC !== undefined ? { temperatureC: system.temperatureC } : {}),
    seen: {
      ...(a.emulsifiedPct !== null ? { emulsionFractionPct: a.emulsifiedPct } : {}),
      ...Object.fromEntries(seen.map((f) => [f, true])),
    },
    tags: a.reagents,
    title: `Emulsion: ${labelOf(system)}`,
  };
}

/**
 * Emulsion help for one person (`owner`, the signed-in user's id): say what the funnel holds and what you see, and get causes and remedies in
 * order. Ranked here in the browser from the knowledge module (so it works offline); the server's
 * answer, with the group's own cases, replaces it when it arrives. Answers persist as a draft.
 */
export function EmulsionHelp({ owner }: { owner: string }) {
  const group = useActiveGroup();
  const router = useRouter();
  const wide = useLayout() === "wide";

  const answers = useDraft<EmulsionAnswers>(`emulsion.answers.${owner}`, BLANK_ANSWERS);
  const stage = useDraft<Stage>(`emulsion.stage.${owner}`, "questions");
  const recent = useDraft<StartingSystem[]>(emulsionRecentKey(owner), []);
  const [showErrors, setShowErrors] = useState(false);

  const a = answers.value;
  const built = useMemo(() => buildRequest(a), [a]);
  const reference = useGroupReference();
  const local = useMemo(() => (built.ok ? computeLocally(built.request, reference) : null), [built, reference]);
  const starts = useMemo(() => startingSystems(owner, recent.value), [owner, recent.value]);
  const [editingSystem, setEditingSystem] = useState(() => !built.ok);

  const showing = wide || stage.value === "answer";
  const ready = built.ok && local?.ok === true;
  const remote = useTroubleshootQuery(group?.id ?? null, showing && ready ? built.request : null);
  const fresh = remote.data && !remote.isPlaceholderData ? remote.data : null;

  const answer: TroubleshootResponse | null = fresh ?? (local?.ok ? local.answer : null);
  const provenance: Provenance = !group
    ? "local"
    : fresh
      ? fresh.groupEvidence
        ? "group"
        : "group-none"
      : remote.isError
        ? "offline"
        : "checking";

  const errors = built.ok ? (local && !local.ok ? local.errors : {}) : built.errors;
  const systemErrors = Object.keys(errors).some((k) => k.startsWith("system."));
  const summary = built.ok && !systemErrors ? labelOf(built.system) : null;

  const start = (id: string) => {
    const s = starts.find((x) => x.id === id);
    if (!s) return;
    answers.set(withSystem(a, s.system));
    setEditingSystem(false);
  };

  const show = () => {
    if (!ready) {
      setShowErrors(true);
      setEditingSystem(true);
      return;
    }
    recent.set((list) => rememberSystem(list, built.system));
    stage.set("answer");
  };

  const startOver = () => {
    answers.clear();
    stage.set("questions");
    setShowErrors(false);
    setEditingSystem(true);
  };

  const caseButton = built.ok ? (
    <Button label="Start a case" variant="secondary" onPress={() => router.push(caseStartHref(prefillOf(built.system, a)) as never)} testID="emulsion-start-case" />
  ) : null;

  const questions = (
    <View style={styles.column}>
      <FunnelFields
        answers={a}
        onChange={answers.set}
        errors={showErrors ? errors : {}}
        summary={summary}
        editing={editingSystem || !summary}
        onEdit={setEditingSystem}
        starts={starts}
        startId={starts.find((x) => summary !== null && x.label.endsWith(summary))?.id ?? null}
        onStart={start}
      />
      <SeenFields answers={a} onChange={answers.set} errors={errors} />
      <KnownFields answers={a} onChange={answers.set} errors={errors} />
      {showErrors && !ready ? (
        <Notice tone="danger" title="A few answers need a look" testID="emulsion-errors">
          {Object.values(errors).slice(0, 3).join(" ")}
        </Notice>
      ) : null}
      <View style={styles.actions}>
        {!wide ? <Button label="Show remedies" onPress={show} testID="emulsion-show" grow /> : null}
        <Button label="Start over" variant="quiet" onPress={startOver} testID="emulsion-start-over" />
      </View>
    </View>
  );

  const results = answer ? (
    <EmulsionResults answer={answer} provenance={provenance} actions={caseButton} />
  ) : (
    <Empty title="Remedies appear here" body="Pick the organic solvent and the aqueous phase with their volumes; the rest helps but can be skipped." />
  );

  if (wide) {
    return (
      <Screen title="Emulsion help" subtitle="Answer what you know, skip the rest: causes and remedies update as you go." width="full">
        <View style={styles.panes}>
          <View style={styles.left}>{questions}</View>
          <View style={styles.right}>{results}</View>
        </View>
      </Screen>
    );
  }
  if (stage.value === "answer" && answer) {
    return (
      <Screen
        key="answer"
        title="Emulsion help"
        subtitle={summary ?? undefined}
        actions={<Button label="Change answers" variant="secondary" onPress={() => stage.set("questions")} testID="emulsion-edit" />}
      >
        {results}
      </Screen>
    );
  }
  return (
    <Screen key="questions" title="Emulsion help" subtitle="A few taps: answer what you know, skip the rest.">
      {questions}
    </Screen>
  );
}

const styles = StyleSheet.create({
  column: { gap: space.lg },
  actions: { flexDirection: "row", flexWrap: "wrap", gap: space.md, alignItems: "center" },
  panes: { flexDirection: "row", gap: space.xl, alignItems: "flex-start" },
  left: { width: 440, flexShrink: 0 },
  right: { flex: 1, minWidth: 0 },
});

/** Route screen: the signed-in user's emulsion help (drafts and recent systems are theirs). */
export function EmulsionScreen() {
  const session = authClient.useSession();
  if (session.isPending) return <Loading />;
  return <EmulsionHelp owner={session.data?.user.id ?? "this-device"} />;
}
