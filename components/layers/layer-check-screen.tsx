import { useGroupReference } from "../../hooks/use-group-reference";
import { useLocalSearchParams, useRouter } from "expo-router";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { Platform, StyleSheet, View } from "react-native";
import { caseStartHref } from "../../hooks/case-prefill";
import { authClient } from "../../hooks/auth-client";
import { useLayout } from "../../hooks/breakpoints";
import { space } from "../../hooks/theme";
import { useDraft, writeDraft } from "../../hooks/use-draft";
import { useRecentChecks, type RecentCheck } from "../../hooks/use-recent-checks";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Text } from "../ui/text";
import { LayerAnswer, LayerDetails, LayerNotes, answerWords } from "./layer-answer";
import { NEW_DRAFT, describeCheck, draftToParams, evaluateDraft, paramsToDraft, paramsToQuery, type CheckParams, type LayerDraft } from "./layer-draft";
import { SystemForm } from "./system-form";

/** A check that stays unchanged this long counts as run and joins the recent list. */
const SETTLE_MS = 1200;
const PARAM_KEYS = ["o", "aq", "c", "av", "t", "g"] as const;

function linkFor(query: string): string {
  const origin = typeof window !== "undefined" && window.location ? window.location.origin : "";
  return `${origin}/layers${query ? `?${query}` : ""}`;
}

async function copyText(text: string): Promise<boolean> {
  try {
    const clip = (globalThis as { navigator?: { clipboard?: { writeText(t: string): Promise<void> } } }).navigator?.clipboard;
    if (!clip) return false;
    await clip.writeText(text);
    return true;
  } catch {
    return false;
  }
}

export interface LayerCheckProps {
  /** whose draft and recent checks these are (the signed-in user's id) */
  owner: string;
}

/**
 * The layer check: pick the phases, and the answer (computed here, in the browser, from the
 * knowledge module) updates as you type. The check lives in the URL, so a link reopens it; the
 * inputs persist as a local draft; the last checks are one tap away.
 */
export function LayerCheck({ owner }: LayerCheckProps) {
  const layout = useLayout();
  const wide = layout === "wide";
  const router = useRouter();
  const params = useLocalSearchParams<CheckParams>();
  const draftKey = `layers.check.${owner}`;
  // A link wins over the stored draft, once, when the screen opens: it becomes the draft.
  useState(() => {
    const fromLink = paramsToDraft(params);
    if (fromLink) writeDraft(draftKey, fromLink);
  });
  const draft = useDraft<LayerDraft>(draftKey, NEW_DRAFT);
  const recent = useRecentChecks(owner);
  const [shared, setShared] = useState<{ link: string; copied: boolean } | null>(null);
  // On a phone a complete check opens on its answer, with the inputs folded into a summary.
  const [formOpen, setFormOpen] = useState(() => evaluateDraft(draft.value).status !== "ok");

  const value = draft.value;
  // A lead's corrections for the group take part in every computation here too.
  const reference = useGroupReference();
  const evaluation = useMemo(() => evaluateDraft(value, reference), [value, reference]);
  const checkParams = useMemo(() => draftToParams(value), [value]);
  const query = paramsToQuery(checkParams);

  // Keep the address in step with the check, so reloading or copying the URL keeps it.
  useEffect(() => {
    if (Platform.OS !== "web") return;
    const next: Record<string, string | undefined> = {};
    for (const k of PARAM_KEYS) next[k] = checkParams[k];
    router.setParams(next);
    // Only when the check changes: checkParams follows query, and router is stable.
  }, [query]);

  // A complete check joins the recent list once it has settled, or at once when the person
  // moves on (a new check, sharing, leaving the screen).
  const { remember } = recent;
  const pending = useRef<Omit<RecentCheck, "at"> | null>(null);
  const flush = useCallback(() => {
    if (pending.current) remember(pending.current);
    pending.current = null;
  }, [remember]);
  useEffect(() => {
    pending.current =
      evaluation.status === "ok" ? { query, label: describeCheck(evaluation.input), answer: answerWords(evaluation.prediction) } : null;
    const timer = setTimeout(flush, SETTLE_MS);
    return () => clearTimeout(timer);
  }, [query, evaluation, flush]);
  useEffect(() => flush, [flush]);

  const openRecent = (q: string) => {
    const d = paramsToDraft(Object.fromEntries(new URLSearchParams(q)));
    if (!d) return;
    draft.set(d);
    setShared(null);
    if (!wide) setFormOpen(false);
  };

  const share = async () => {
    flush();
    const link = linkFor(query);
    setShared({ link, copied: await copyText(link) });
  };

  const recentStrip = recent.checks.length ? (
    <View style={styles.recent}>
      <Text bold size="label">
        Recent checks
      </Text>
      <Chips
        label="Recent checks"
        options={recent.checks.map((c) => ({ value: c.query, label: c.label }))}
        selected={recent.checks.some((c) => c.query === query) ? query : null}
        onSelect={openRecent}
        scroll={!wide}
        testID="recent"
      />
    </View>
  ) : null;

  const form = <SystemForm draft={value} onChange={draft.set} errors={evaluation.errors} reference={reference} />;
  const systemCard =
    wide || formOpen ? (
      <View style={styles.stack}>
        {form}
        {!wide && evaluation.status === "ok" ? (
          <Button label="Done: show the answer" variant="secondary" onPress={() => setFormOpen(false)} testID="form-done" />
        ) : null}
      </View>
    ) : (
      <Card testID="system-summary">
        <Text bold size="label">
          The system
        </Text>
        <Text size="title">{evaluation.status === "ok" ? describeCheck(evaluation.input) : "Not complete"}</Text>
        <Button label="Change the system" variant="secondary" onPress={() => setFormOpen(true)} testID="form-edit" />
      </Card>
    );

  const after =
    evaluation.status === "ok" ? (
      <>
        <LayerNotes prediction={evaluation.prediction} />
        <LayerDetails input={evaluation.input} prediction={evaluation.prediction} />
        <Button
          label="Log a case with this system"
          variant="quiet"
          onPress={() => router.push(caseStartHref({ organic: evaluation.input.organic, aqueous: evaluation.input.aqueous, temperatureC: evaluation.input.temperatureC }) as never)}
          testID="start-case"
        />
      </>
    ) : null;

  const sharedNotice = shared ? (
    <Notice tone="good" title={shared.copied ? "Link copied" : "Link to this check"} testID="share-notice">
      <Text selectable>{shared.link}</Text>
    </Notice>
  ) : null;

  const actions = (
    <>
      <Button label="Share link" variant="secondary" onPress={share} disabled={evaluation.status !== "ok"} testID="share" />
      <Button
        label="New check"
        variant="quiet"
        onPress={() => {
          flush();
          draft.set(NEW_DRAFT);
          setShared(null);
          setFormOpen(true);
        }}
        testID="new-check"
      />
    </>
  );

  return (
    <Screen title="Layer check" subtitle="Which layer is which, from the phase densities" width={wide ? "full" : "column"} actions={actions}>
      {wide ? (
        <View style={styles.columns}>
          <View style={[styles.stack, styles.answerColumn]}>
            {sharedNotice}
            <LayerAnswer evaluation={evaluation} drawingWidth={340} />
            {after}
          </View>
          <View style={[styles.stack, styles.formColumn]}>
            {recentStrip}
            {systemCard}
          </View>
        </View>
      ) : (
        <View style={styles.stack}>
          {recentStrip}
          {sharedNotice}
          <LayerAnswer evaluation={evaluation} />
          {systemCard}
          {after}
        </View>
      )}
    </Screen>
  );
}

/** Route screen: the signed-in user's layer check. */
export function LayerCheckScreen() {
  const session = authClient.useSession();
  return <LayerCheck owner={session.data?.user.id ?? "this-device"} />;
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  recent: { gap: space.xs },
  columns: { flexDirection: "row", alignItems: "flex-start", gap: space.xl },
  answerColumn: { flex: 1.1, minWidth: 0 },
  formColumn: { flex: 1, minWidth: 0, maxWidth: 560 },
});
