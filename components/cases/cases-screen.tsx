import { useRouter } from "expo-router";
import { useEffect, useMemo, useState } from "react";
import { Linking, Platform, ScrollView, StyleSheet, useWindowDimensions, View } from "react-native";
import { useLayout } from "../../hooks/breakpoints";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { caseExportUrl, useCaseQuery, useCasesQuery, type CaseFilters } from "../../hooks/use-cases";
import { useDraft } from "../../hooks/use-draft";
import { useActiveGroup, useMembersQuery } from "../../hooks/use-me";
import { Button } from "../ui/button";
import { Field } from "../ui/field";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { CaseDetailView } from "./case-detail";
import { activeFilterCount, CaseFilterPanel, EMPTY_FILTERS, toQuery, type FilterState } from "./case-filters";
import { CaseCard, CaseTable, type SortState } from "./case-rows";

const PAGE = 50;

interface ListView {
  filters: FilterState;
  sort: SortState | null;
  selected: string | null;
}
const INITIAL_VIEW: ListView = { filters: EMPTY_FILTERS, sort: null, selected: null };
const SEARCH_DELAY_MS = 300;

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

/** The CSV of what the list shows: a real link on the web (the browser downloads it with the session cookie). */
function ExportLink({ filters }: { filters: CaseFilters }) {
  const href = caseExportUrl(filters);
  if (Platform.OS === "web") {
    // react-native-web renders Text with href as <a>; hrefAttrs sets download.
    const anchor = { href, hrefAttrs: { download: "cases.csv" } } as object;
    return (
      <Text {...anchor} accessibilityRole="link" bold size="label" tone="brand" style={styles.exportLink} testID="cases-export">
        Export CSV
      </Text>
    );
  }
  return <Button label="Export CSV" variant="secondary" onPress={() => Linking.openURL(href)} testID="cases-export" />;
}

function DetailPane({ id, userId, onOpen }: { id: string; userId: string; onOpen: (id: string) => void }) {
  const q = useCaseQuery(id);
  if (q.isPending) return <Loading label="Loading the case…" />;
  if (q.isError) return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  return (
    <View style={styles.paneInner} testID="case-pane">
      <Text size="headline">{q.data.title}</Text>
      <CaseDetailView detail={q.data} userId={userId} onOpenCase={onOpen} />
    </View>
  );
}

/** /cases: one search box, filters, what worked at a glance; cards on a phone, a table and a side pane on a wide screen. */
export function CasesScreen() {
  const layout = useLayout();
  const wide = layout === "wide";
  const { height } = useWindowDimensions();
  const router = useRouter();
  const group = useActiveGroup();
  const members = useMembersQuery(group?.id).data?.members ?? [];
  // The search, sort and open case outlive the screen: back from a case, a rotated phone or a
  // window crossing the breakpoint (the shell remounts) all find the list as it was left.
  const view = useDraft<ListView>(`cases-list:${group?.userId ?? ""}`, INITIAL_VIEW);
  const { filters, sort, selected } = view.value;
  const setFilters = (next: FilterState | ((f: FilterState) => FilterState)) =>
    view.set((v) => ({ ...v, filters: typeof next === "function" ? next(v.filters) : next }));
  const setSort = (s: SortState) => view.set((v) => ({ ...v, sort: s }));
  const setSelected = (id: string | null) => view.set((v) => ({ ...v, selected: id }));
  const [showFilters, setShowFilters] = useState(false);
  const [limit, setLimit] = useState(PAGE);
  const [paneTop, setPaneTop] = useState(0);

  const debounced = useDebounced(filters, SEARCH_DELAY_MS);
  const query: CaseFilters = useMemo(
    () => ({ ...toQuery(debounced), ...(sort ? { sort: sort.sort, order: sort.order } : {}), limit }),
    [debounced, sort, limit],
  );
  const list = useCasesQuery(query);
  const filterCount = activeFilterCount(filters);
  const searching = filters.q.trim() !== "" || filterCount > 0;
  // The table shows the order the server used: relevance while searching, newest first otherwise.
  const shownSort: SortState = sort ?? { sort: filters.q.trim() ? "relevance" : "occurredAt", order: "desc" };

  const newCase = <Button label="Log a case" onPress={() => router.push("/cases/new" as never)} testID="cases-new" />;

  const results = (() => {
    if (list.isPending) return <Loading label="Finding cases…" />;
    if (list.isError) return <ErrorState error={list.error} onRetry={() => list.refetch()} />;
    const { cases, total, totalIsLowerBound } = list.data;
    if (!cases.length) {
      return searching ? (
        <Empty
          title="Nothing matches"
          body="Try fewer filters or another word. Solvents and solutions match by any name: DCM, methylene chloride and CH2Cl2 find the same cases."
          action={<Button label="Clear search and filters" variant="secondary" onPress={() => setFilters(EMPTY_FILTERS)} testID="cases-clear" />}
        />
      ) : (
        <Empty
          title="No cases logged yet"
          body="Each stubborn emulsion, surprise layer order or fix that worked, logged at the hood with a photo. Months later anyone in the group finds what cleared it."
          action={newCase}
        />
      );
    }
    const more =
      total > cases.length ? (
        <Button
          label={totalIsLowerBound ? "Show more" : `Show more (${total - cases.length} left)`}
          variant="secondary"
          onPress={() => setLimit((l) => l + PAGE)}
          testID="cases-more"
        />
      ) : null;
    return (
      <View style={styles.results}>
        <View style={styles.countRow}>
          <Text size="label" tone="inkMuted" testID="cases-count" accessibilityLiveRegion="polite">
            {totalIsLowerBound ? `${total}+ cases` : total === 1 ? "1 case" : `${total} cases`}
            {list.isFetching || list.isPlaceholderData ? " · updating…" : query.q && !sort ? " · best match first" : ""}
          </Text>
          <ExportLink filters={query} />
        </View>
        {wide ? (
          <CaseTable
            cases={cases}
            sort={shownSort}
            onSort={(s) => setSort(s)}
            selectedId={selected}
            onSelect={setSelected}
            compact={!!selected}
          />
        ) : (
          cases.map((c) => <CaseCard key={c.id} c={c} />)
        )}
        {more}
      </View>
    );
  })();

  const head = (
    <View style={styles.head}>
      <View style={styles.searchRow}>
        <View style={styles.search}>
          <Field
            label="Search cases"
            value={filters.q}
            onChangeText={(t) => setFilters((f) => ({ ...f, q: t }))}
            placeholder="solvent, remedy, tag, words from the notes"
            autoCapitalize="none"
            autoCorrect={false}
            returnKeyType="search"
            testID="cases-search"
          />
        </View>
        <Button
          label={filterCount ? `Filters (${filterCount})` : "Filters"}
          variant={showFilters ? "primary" : "secondary"}
          onPress={() => setShowFilters((s) => !s)}
          testID="cases-filters-toggle"
        />
      </View>
      {showFilters ? (
        <View style={styles.filterBox}>
          <CaseFilterPanel value={filters} onChange={setFilters} members={members} userId={group?.userId ?? ""} />
        </View>
      ) : null}
    </View>
  );

  if (!wide) {
    return (
      <Screen title="Cases" subtitle="What the group tried, and what worked" actions={newCase}>
        {head}
        {results}
      </Screen>
    );
  }

  // Wide: the page stays put; the list and the side pane scroll on their own.
  const paneHeight = Math.max(320, height - paneTop - space.lg - space.xxl);
  return (
    <Screen title="Cases" subtitle="What the group tried, and what worked" actions={newCase} width="full" scroll={false}>
      {head}
      <View style={[styles.panes, { height: paneHeight }]} onLayout={(e) => setPaneTop(e.nativeEvent.layout.y + space.lg)}>
        <ScrollView style={styles.listPane} contentContainerStyle={styles.paneContent}>
          {results}
        </ScrollView>
        {selected ? (
          <View style={styles.detailPane}>
            <View style={styles.paneBar}>
              <Button label="Open full page" variant="quiet" onPress={() => router.push(`/cases/${selected}` as never)} testID="pane-open" />
              <Button label="Close" variant="quiet" onPress={() => setSelected(null)} testID="pane-close" />
            </View>
            <ScrollView contentContainerStyle={styles.paneContent}>
              <DetailPane id={selected} userId={group?.userId ?? ""} onOpen={setSelected} />
            </ScrollView>
          </View>
        ) : null}
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  head: { gap: space.md },
  searchRow: { flexDirection: "row", flexWrap: "wrap", gap: space.sm, alignItems: "flex-end" },
  search: { flexGrow: 1, flexBasis: 240 },
  filterBox: { backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.line, padding: space.lg },
  exportLink: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.lg,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: colors.brand,
    backgroundColor: colors.surface,
    textAlignVertical: "center",
    lineHeight: TOUCH_MIN - 4,
  },
  results: { gap: space.md },
  countRow: { flexDirection: "row", flexWrap: "wrap", alignItems: "center", justifyContent: "space-between", gap: space.sm },
  panes: { flexDirection: "row", gap: space.lg },
  listPane: { flex: 1 },
  detailPane: { flex: 1, maxWidth: 560, backgroundColor: colors.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: colors.line },
  paneBar: { flexDirection: "row", justifyContent: "flex-end", borderBottomWidth: 1, borderBottomColor: colors.line, paddingHorizontal: space.sm },
  paneContent: { padding: space.xs, paddingBottom: space.xl, gap: space.md },
  paneInner: { gap: space.md, padding: space.md },
});
