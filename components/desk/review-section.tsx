import { useMemo, useState } from "react";
import { Platform, Pressable, ScrollView, StyleSheet, View, useWindowDimensions } from "react-native";
import { useRouter } from "expo-router";
import type { CaseSummary } from "../../knowledge/contracts/cases";
import type { ReviewItem, ReviewKind } from "../../knowledge/contracts/curation";
import { ApiError } from "../../hooks/api";
import { useLayout } from "../../hooks/breakpoints";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { useCasesQuery } from "../../hooks/use-cases";
import { useBulkVerifyMutation, useMyRequestsQuery, useReviewQuery } from "../../hooks/use-curation";
import { StatusPill } from "../cases/pill";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { CaseRequests } from "./case-requests";
import { DataTable, type Column } from "./data-table";
import type { DeskSectionProps } from "./desk-sections";
import { formatDay } from "./format";
import { LinkRow } from "./link-row";
import { ReviewDetail } from "./review-detail";

type View_ = ReviewKind | "retired";

const KIND_LABEL: Record<View_, string> = { all: "All to review", new: "New", resolved: "Resolved", asked: "Waiting on the author", retired: "Retired" };

function Checkbox({ checked, label, onToggle, testID }: { checked: boolean; label: string; onToggle: () => void; testID?: string }) {
  return (
    <Pressable accessibilityRole="checkbox" accessibilityState={{ checked }} accessibilityLabel={label} onPress={onToggle} style={styles.checkbox} testID={testID}>
      <View style={[styles.box, checked && styles.boxOn]}>
        <Text bold tone="brandInk" size="label">
          {checked ? "✓" : " "}
        </Text>
      </View>
    </Pressable>
  );
}

function TitleButton({ title, sub, onPress, testID }: { title: string; sub: string; onPress: () => void; testID: string }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={`Review ${title}`} onPress={onPress} style={styles.titleButton} testID={testID}>
      <Text bold tone="brand" style={styles.link}>
        {title}
      </Text>
      <Text size="caption" tone="inkMuted">
        {sub}
      </Text>
    </Pressable>
  );
}

/** What the signed-in member has been asked about their own cases. */
function AskedOfMe({ userId }: { userId: string }) {
  const q = useMyRequestsQuery("open");
  const router = useRouter();
  const requests = q.data?.requests ?? [];
  if (requests.length === 0) return null;
  const byCase = [...new Map(requests.map((r) => [r.caseId, r])).values()];
  return (
    <Card testID="asked-of-me">
      <Text size="title" bold>
        Asked of you ({requests.length})
      </Text>
      {byCase.map((r) => (
        <View key={r.caseId} style={styles.asked}>
          <LinkRow label={r.caseTitle} onPress={() => router.push(`/cases/${r.caseId}` as never)} />
          <CaseRequests caseId={r.caseId} authorId={userId} userId={userId} isLead={false} />
        </View>
      ))}
    </Card>
  );
}

function Queue({
  view,
  selected,
  setSelected,
  open,
  openId,
  compact,
}: {
  view: ReviewKind;
  selected: Set<string>;
  setSelected: (s: Set<string>) => void;
  open: (item: ReviewItem) => void;
  openId: string | null;
  /** a case is open beside the list: fewer, wider columns */
  compact: boolean;
}) {
  const q = useReviewQuery(view);
  const bulk = useBulkVerifyMutation();
  const items = useMemo(() => q.data?.items ?? [], [q.data]);
  if (q.isPending) return <Loading label="Loading the queue…" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  if (items.length === 0) {
    return <Empty title="Nothing to review" body="New and newly resolved cases the group logs appear here until a lead verifies or retires them." />;
  }
  const toggle = (id: string) => {
    const next = new Set(selected);
    if (next.has(id)) next.delete(id);
    else next.add(id);
    setSelected(next);
  };
  const allOn = items.every((i) => selected.has(i.id));
  const columns: Column<ReviewItem>[] = [
    {
      key: "pick",
      title: "Pick",
      flex: 0.45,
      render: (i) => <Checkbox checked={selected.has(i.id)} label={`Select ${i.title}`} onToggle={() => toggle(i.id)} testID={`review-pick-${i.id}`} />,
    },
    {
      key: "title",
      title: "Case",
      flex: 2.4,
      sortValue: (i) => i.title.toLowerCase(),
      render: (i) => (
        <TitleButton
          title={`${openId === i.id ? "▸ " : ""}${i.title}`}
          sub={`${i.authorName} · ${i.solvents.join(" + ") || "solvent not resolved"} over ${i.aqueousLabel}`}
          onPress={() => open(i)}
          testID={`review-open-${i.id}`}
        />
      ),
    },
    { key: "status", title: "Status", flex: 1, sortValue: (i) => i.status, render: (i) => <StatusPill status={i.status} /> },
    { key: "worked", title: "What worked", flex: 1.8, render: (i) => i.whatWorked ?? "nothing yet" },
    {
      key: "checks",
      title: "To check",
      flex: 1,
      sortValue: (i) => -i.checks.filter((c) => c.tone !== "info").length,
      render: (i) => {
        const serious = i.checks.filter((c) => c.tone !== "info");
        return (
          <Text tone={serious.some((c) => c.tone === "danger") ? "danger" : serious.length ? "caution" : "inkMuted"} bold={serious.length > 0}>
            {serious.length ? `${serious.length} to check` : "looks complete"}
            {i.openRequests ? ` · ${i.openRequests} asked` : ""}
          </Text>
        );
      },
    },
    { key: "updated", title: "Updated", flex: 1, sortValue: (i) => i.updatedAt, render: (i) => formatDay(i.updatedAt) },
  ];
  // Beside an open case the table keeps the case, what worked and the date; the pane has the rest.
  const shown = compact ? columns.filter((c) => ["pick", "title", "worked", "updated"].includes(c.key)) : columns;
  const picked = items.filter((i) => selected.has(i.id));
  return (
    <View style={styles.queue}>
      <View style={styles.bulk}>
        <Checkbox checked={allOn} label={allOn ? "Clear the selection" : "Select every case shown"} onToggle={() => setSelected(allOn ? new Set() : new Set(items.map((i) => i.id)))} testID="review-pick-all" />
        <Text style={styles.grow}>{picked.length ? `${picked.length} selected` : "Select cases to verify several at once"}</Text>
        <Button
          label={`Verify selected (${picked.length})`}
          disabled={picked.length === 0}
          busy={bulk.isPending}
          onPress={() => bulk.mutate(picked.map((i) => i.id), { onSuccess: () => setSelected(new Set()) })}
          testID="review-bulk-verify"
        />
      </View>
      {bulk.error ? <Text tone="danger">{bulk.error instanceof ApiError ? bulk.error.message : "Verifying failed; nothing was changed."}</Text> : null}
      {bulk.isSuccess ? <Text tone="good">Verified {bulk.data.verified.length} cases, each with its first clearing attempt as the fix.</Text> : null}
      <DataTable label="Cases to review" rows={items} columns={shown} rowKey={(i) => i.id} initialSort={{ key: "updated", direction: "desc" }} testID="review-table" />
    </View>
  );
}

function RetiredList({ open, openId }: { open: (id: string) => void; openId: string | null }) {
  const q = useCasesQuery({ includeRetired: true, limit: 200, sort: "updatedAt", order: "desc" });
  if (q.isPending) return <Loading />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  const retired = q.data.cases.filter((c) => c.retired);
  if (retired.length === 0) return <Empty title="Nothing retired" body="Retired and merged cases wait here; open one to restore it." />;
  const columns: Column<CaseSummary>[] = [
    {
      key: "title",
      title: "Case",
      flex: 2.5,
      sortValue: (c) => c.title.toLowerCase(),
      render: (c) => <TitleButton title={`${openId === c.id ? "▸ " : ""}${c.title}`} sub={`${c.authorName} · ${c.solvents.join(" + ")}`} onPress={() => open(c.id)} testID={`retired-open-${c.id}`} />,
    },
    { key: "worked", title: "What worked", flex: 2, render: (c) => c.whatWorked ?? "nothing" },
    { key: "updated", title: "Changed", flex: 1, sortValue: (c) => c.updatedAt, render: (c) => formatDay(c.updatedAt) },
  ];
  return <DataTable label="Retired cases" rows={retired} columns={columns} rowKey={(c) => c.id} testID="retired-table" />;
}

/** Desk › Review: the queue of cases to verify, with the case and its actions beside it. */
export function ReviewSection({ group, canAct }: DeskSectionProps) {
  const layout = useLayout();
  const { height } = useWindowDimensions();
  const [view, setView] = useState<View_>("all");
  const [selected, setSelected] = useState<Set<string>>(new Set());
  const [openItem, setOpenItem] = useState<{ id: string; item?: ReviewItem } | null>(null);
  const counts = useReviewQuery("all", canAct).data?.counts;

  if (!canAct) {
    return (
      <View style={styles.section}>
        <AskedOfMe userId={group.userId} />
        <Text tone="inkMuted">Leads verify the group&apos;s cases here, ask authors for more, merge duplicates and retire what no longer holds.</Text>
      </View>
    );
  }
  const detail = openItem ? <ReviewDetail key={openItem.id} caseId={openItem.id} item={openItem.item} userId={group.userId} onClose={() => setOpenItem(null)} /> : null;
  const list =
    view === "retired" ? (
      <RetiredList open={(id) => setOpenItem({ id })} openId={openItem?.id ?? null} />
    ) : (
      <Queue
        view={view}
        selected={selected}
        setSelected={setSelected}
        open={(item) => setOpenItem({ id: item.id, item })}
        openId={openItem?.id ?? null}
        compact={layout === "wide" && openItem !== null}
      />
    );
  const options = (Object.keys(KIND_LABEL) as View_[]).map((k) => ({
    value: k,
    label: k !== "retired" && counts ? `${KIND_LABEL[k]} (${counts[k]})` : KIND_LABEL[k],
  }));
  return (
    <View style={styles.section}>
      <AskedOfMe userId={group.userId} />
      <Chips label="Show" options={options} selected={view} onSelect={(v) => { setView(v); setSelected(new Set()); }} scroll testID="review-view" />
      {layout === "wide" ? (
        <View style={styles.panes}>
          <View style={styles.listPane}>{list}</View>
          {detail ? (
            // The pane stays in view while the list scrolls under it, with its own scroll.
            <View style={[styles.detailPane, STICKY]}>
              <ScrollView style={{ maxHeight: height - space.lg * 2 }}>{detail}</ScrollView>
            </View>
          ) : null}
        </View>
      ) : detail ? (
        // On a phone the case takes the screen; closing it returns to the queue.
        detail
      ) : (
        list
      )}
    </View>
  );
}

/** position: sticky exists on the web only (react-native-web passes it through). */
const STICKY = Platform.OS === "web" ? ({ position: "sticky", top: space.lg } as unknown as object) : null;

const styles = StyleSheet.create({
  section: { gap: space.lg },
  panes: { flexDirection: "row", alignItems: "flex-start", gap: space.lg },
  listPane: { flex: 3, minWidth: 0 },
  detailPane: { flex: 2, minWidth: 320 },
  queue: { gap: space.md },
  bulk: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", gap: space.md },
  grow: { flexGrow: 1, flexShrink: 1 },
  checkbox: { minWidth: TOUCH_MIN, minHeight: TOUCH_MIN, alignItems: "center", justifyContent: "center" },
  box: { width: 26, height: 26, borderRadius: radii.sm, borderWidth: 2, borderColor: colors.brand, backgroundColor: colors.surface, alignItems: "center", justifyContent: "center" },
  boxOn: { backgroundColor: colors.brand },
  titleButton: { minHeight: TOUCH_MIN, justifyContent: "center", gap: 2 },
  link: { textDecorationLine: "underline" },
  asked: { gap: space.xs },
});
