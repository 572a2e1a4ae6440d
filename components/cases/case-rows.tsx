import { Link } from "expo-router";
import { Image, Pressable, StyleSheet, View } from "react-native";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import type { CaseSortKey, CaseSummary } from "../../knowledge/contracts/cases";
import { Text } from "../ui/text";
import { formatDate } from "./format";
import { photoSrc } from "./photos";
import { Pill, StatusPill } from "./pill";
import { KIND, OUTCOME } from "./vocab";

/** The line that answers "what worked?" at a glance. */
export function workedLine(c: CaseSummary): { text: string; tone: "good" | "inkMuted" | "caution" } {
  if (c.whatWorked) {
    const partly = c.bestOutcome === "partly";
    return { text: `${OUTCOME[partly ? "partly" : "cleared"].mark} ${c.whatWorked}`, tone: partly ? "caution" : "good" };
  }
  if (c.bestOutcome === "partly") return { text: `${OUTCOME.partly.mark} partly cleared after ${c.attemptCount} attempt${c.attemptCount === 1 ? "" : "s"}`, tone: "caution" };
  if (c.attemptCount) return { text: `${c.attemptCount} attempt${c.attemptCount === 1 ? "" : "s"}, nothing cleared it yet`, tone: "inkMuted" };
  return { text: "no attempts logged", tone: "inkMuted" };
}

export function systemLine(c: CaseSummary): string {
  return [c.solvents.join(" + "), c.aqueousLabel].filter(Boolean).join(" over ");
}

/** A phone card: title, what worked, the system, and a thumbnail when there is one. */
export function CaseCard({ c }: { c: CaseSummary }) {
  const w = workedLine(c);
  return (
    <Link href={`/cases/${c.id}` as never} asChild>
      <Pressable accessibilityRole="link" accessibilityLabel={`${c.title}. ${w.text}`} style={StyleSheet.flatten(styles.card)} testID={`case-card-${c.id}`}>
        <View style={styles.cardBody}>
          <Text bold size="label" numberOfLines={2}>
            {c.title}
          </Text>
          <Text size="label" bold tone={w.tone} numberOfLines={2}>
            {w.text}
          </Text>
          <Text size="caption" tone="inkMuted" numberOfLines={2}>
            {systemLine(c)}
          </Text>
          <View style={styles.metaRow}>
            <StatusPill status={c.status} />
            {c.verified ? <Pill tone="good" label="✓ Checked" /> : null}
            {c.kind && c.kind !== "none" ? <Pill tone="neutral" label={KIND[c.kind]} /> : null}
            <Text size="caption" tone="inkMuted">
              {formatDate(c.occurredAt)} · {c.authorName}
            </Text>
          </View>
        </View>
        {c.thumbnailUrl ? <Image source={{ uri: photoSrc(c.thumbnailUrl) }} style={styles.thumb} accessibilityLabel="Photo" /> : null}
      </Pressable>
    </Link>
  );
}

export interface SortState {
  sort: CaseSortKey;
  order: "asc" | "desc";
}

const COLUMNS: { key: string; label: string; sort?: CaseSortKey; flex: number; compact: boolean }[] = [
  { key: "title", label: "Case and what worked", sort: "title", flex: 3, compact: true },
  { key: "system", label: "System", flex: 2, compact: false },
  { key: "status", label: "Status", sort: "status", flex: 1, compact: true },
  { key: "date", label: "Date", sort: "occurredAt", flex: 1, compact: true },
  { key: "author", label: "By", flex: 1, compact: false },
];

function SortHeader({ col, sort, onSort }: { col: (typeof COLUMNS)[number]; sort: SortState; onSort: (s: SortState) => void }) {
  const active = col.sort && sort.sort === col.sort;
  const arrow = active ? (sort.order === "asc" ? " ▲" : " ▼") : "";
  if (!col.sort) {
    return (
      <View style={[styles.th, { flex: col.flex }]}>
        <Text size="caption" bold tone="inkMuted">
          {col.label}
        </Text>
      </View>
    );
  }
  const next: SortState = active ? { sort: col.sort, order: sort.order === "asc" ? "desc" : "asc" } : { sort: col.sort, order: col.sort === "title" ? "asc" : "desc" };
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={`Sort by ${col.label}${active ? (sort.order === "asc" ? ", ascending" : ", descending") : ""}`}
      onPress={() => onSort(next)}
      style={[styles.th, { flex: col.flex }]}
      testID={`sort-${col.sort}`}
    >
      <Text size="caption" bold tone={active ? "brand" : "inkMuted"}>
        {col.label}
        {arrow}
      </Text>
    </Pressable>
  );
}

/** The wide-screen table: sortable headers; a row opens the case in the side pane. */
export function CaseTable({
  cases,
  sort,
  onSort,
  selectedId,
  onSelect,
  compact,
}: {
  cases: CaseSummary[];
  sort: SortState;
  onSort: (s: SortState) => void;
  selectedId: string | null;
  onSelect: (id: string) => void;
  compact: boolean;
}) {
  const cols = COLUMNS.filter((c) => !compact || c.compact);
  return (
    <View style={styles.table} accessibilityRole="list" testID="case-table">
      <View style={styles.headRow}>
        {cols.map((c) => (
          <SortHeader key={c.key} col={c} sort={sort} onSort={onSort} />
        ))}
      </View>
      {cases.map((c) => {
        const w = workedLine(c);
        const on = c.id === selectedId;
        return (
          <Pressable
            key={c.id}
            accessibilityRole="button"
            accessibilityState={{ selected: on }}
            accessibilityLabel={`${c.title}. ${w.text}`}
            onPress={() => onSelect(c.id)}
            style={[styles.tr, on && styles.trOn]}
            testID={`case-row-${c.id}`}
          >
            {cols.map((col) => (
              <View key={col.key} style={[styles.td, { flex: col.flex }]}>
                {col.key === "title" ? (
                  <>
                    <Text bold size="label">
                      {c.title}
                    </Text>
                    <Text size="caption" bold tone={w.tone}>
                      {w.text}
                    </Text>
                  </>
                ) : col.key === "system" ? (
                  <Text size="caption">{systemLine(c)}</Text>
                ) : col.key === "status" ? (
                  <View style={styles.metaRow}>
                    <StatusPill status={c.status} />
                    {c.verified ? <Pill tone="good" label="✓ Checked" /> : null}
                  </View>
                ) : col.key === "date" ? (
                  <Text size="caption">{formatDate(c.occurredAt)}</Text>
                ) : (
                  <Text size="caption">{c.authorName}</Text>
                )}
              </View>
            ))}
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    flexDirection: "row",
    gap: space.md,
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.md,
    minHeight: TOUCH_MIN,
  },
  cardBody: { flex: 1, gap: space.xs },
  thumb: { width: 72, height: 72, borderRadius: radii.sm, backgroundColor: colors.line },
  metaRow: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "center" },
  table: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.line, overflow: "hidden" },
  headRow: { flexDirection: "row", borderBottomWidth: 2, borderBottomColor: colors.line, paddingHorizontal: space.sm },
  th: { minHeight: TOUCH_MIN, justifyContent: "center", paddingHorizontal: space.sm },
  tr: { flexDirection: "row", paddingHorizontal: space.sm, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line, minHeight: TOUCH_MIN },
  trOn: { backgroundColor: colors.infoSoft },
  td: { paddingHorizontal: space.sm, gap: 2, justifyContent: "center" },
});
