import { useLocalSearchParams, useRouter } from "expo-router";
import { useEffect, useMemo } from "react";
import { Platform, StyleSheet, View } from "react-native";
import { space } from "../../hooks/theme";
import { readDraft } from "../../hooks/use-draft";
import { useActiveGroup } from "../../hooks/use-me";
import { usePlanQuery } from "../../hooks/use-plans";
import { formatDateTime } from "../cases/format";
import { Button } from "../ui/button";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { BenchCard } from "./bench-card";
import { draftFromDocument, recoverySettingsOf, type PlanDraft } from "./plan-draft";
import { usePlanEvaluation } from "./use-plan-evaluation";
import { washShortLabel } from "./plan-format";
import { newPlanDraftKey } from "./plan-screen";

/*
 * On paper only the card prints: the navigation, the buttons and the scroll containers' clipping
 * go away, so the whole card lands on one page.
 */
const PRINT_CSS = `
@media print {
  @page { size: A4; margin: 10mm; }
  html, body, #root { height: auto !important; overflow: visible !important; background: #fff !important; }
  #root div { overflow: visible !important; }
  [data-testid="tab-bar"], [data-testid="side-rail"], div:has(> div > [data-testid="bench-actions"]) { display: none !important; }
  [data-testid="bench-card"] { border: none !important; padding: 0 !important; max-width: none !important; }
  [data-testid="bench-card"] div, [data-testid="bench-card"] span { font-size: 10.5px !important; line-height: 13px !important; }
  [data-testid="bench-card"] [data-testid="bench-card-title"] { font-size: 16px !important; line-height: 20px !important; }
}`;

function usePrintStyles() {
  useEffect(() => {
    if (Platform.OS !== "web" || typeof document === "undefined") return;
    const el = document.createElement("style");
    el.setAttribute("data-phasewise", "bench-card-print");
    el.textContent = PRINT_CSS;
    document.head.appendChild(el);
    return () => el.remove();
  }, []);
}

/** /plan/print?id=… (a saved plan) or /plan/print (the plan being built): the one-page bench card. */
export function BenchCardScreen() {
  usePrintStyles();
  const { id } = useLocalSearchParams<{ id?: string }>();
  const group = useActiveGroup();
  const q = usePlanQuery(id);
  const router = useRouter();
  const backTo = id ? `/plan/${id}` : "/plan";
  const actions = (
    <View style={styles.actions} testID="bench-actions">
      <Button label="Back to the plan" variant="secondary" onPress={() => router.navigate(backTo as never)} testID="bench-back" />
      {Platform.OS === "web" ? <Button label="Print" onPress={() => window.print()} testID="bench-print" /> : null}
    </View>
  );

  const source = useMemo((): { draft: PlanDraft; footnote: string } | null => {
    if (id) {
      if (!q.data) return null;
      const p = q.data;
      return { draft: draftFromDocument(p.input, p.title, p.notes), footnote: `Saved plan by ${p.author.name}, ${formatDateTime(p.updatedAt)} · printed ${formatDateTime(new Date().toISOString())}` };
    }
    if (!group) return null;
    const stored = readDraft<PlanDraft>(newPlanDraftKey(group.userId));
    return stored ? { draft: stored.data, footnote: `Unsaved plan · printed ${formatDateTime(new Date().toISOString())}` } : null;
  }, [id, q.data, group]);

  const computed = usePlanEvaluation(source?.draft ?? null);
  const evaluation = computed.evaluation;

  let body: React.ReactNode;
  if (id && q.isPending) body = <Loading label="Loading the plan…" />;
  else if (id && q.isError) body = <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  else if (!source || !evaluation) body = <Empty title="No plan to print yet" body="Build a plan first; its bench card appears here." action={<Button label="Build a plan" onPress={() => router.navigate("/plan" as never)} />} />;
  else if (evaluation.status !== "ok")
    body = (
      <Notice tone="caution" title="The plan is not complete">
        {evaluation.status === "incomplete" ? `Still needed: ${evaluation.missing.join(", ")}.` : Object.values(evaluation.errors).join(" ")}
      </Notice>
    );
  else {
    const recovery = computed.recovery!;
    const evaporation = computed.evaporation!;
    const settings = recoverySettingsOf(source.draft).settings;
    body = (
      <BenchCard
        title={source.draft.title.trim() || "Work-up plan"}
        doc={evaluation.doc}
        result={evaluation.result}
        recovery={recovery.status === "ok" ? recovery.value : undefined}
        evaporation={evaporation.status === "ok" ? evaporation.value : undefined}
        reagent={settings ? washShortLabel({ aqueous: settings.reagent }) : undefined}
        footnote={source.footnote}
      />
    );
  }
  return (
    <Screen title="Bench card" subtitle="One page for the hood" actions={actions} width="full">
      {body}
    </Screen>
  );
}

const styles = StyleSheet.create({ actions: { flexDirection: "row", flexWrap: "wrap", gap: space.sm } });
