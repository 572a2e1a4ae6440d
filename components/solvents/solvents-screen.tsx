import { useRouter } from "expo-router";
import { useEffect, useMemo, useState } from "react";
import { Pressable, ScrollView, StyleSheet, View, useWindowDimensions } from "react-native";
import type { SolventListItem } from "../../knowledge/contracts/solvents";
import { useLayout } from "../../hooks/breakpoints";
import { colors, radii, space, toneColors, TOUCH_MIN } from "../../hooks/theme";
import { useSolventsQuery } from "../../hooks/use-solvents";
import { Button } from "../ui/button";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { trimNumber } from "../ui/format";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { solventAbbreviation } from "../ui/solvent-picker";
import { SolventDetailView } from "./solvent-detail";
import { GUIDE_LABEL, GUIDE_RANK, GUIDE_TONE, MISCIBILITY_LABEL } from "./solvent-words";

type SortKey = "match" | "name" | "density" | "bp" | "flash" | "guide";
interface Sort {
  by: SortKey;
  descending: boolean;
}

const SEARCH_DELAY_MS = 200;
/** Room the screen title and padding take above the wide panes. */
const PANE_TOP_PX = 136;
const MIN_PANE_PX = 420;

const SORT_LABEL: Record<SortKey, string> = {
  match: "Best match",
  name: "Name",
  density: "Density",
  bp: "Boiling point",
  flash: "Flash point",
  guide: "CHEM21 category",
};

/** Sort values; a missing flash point (none) goes last either way. */
const SORT_VALUE: Record<Exclude<SortKey, "match" | "name">, (s: SolventListItem) => number | null> = {
  density: (s) => s.densityGPerMl20C,
  bp: (s) => s.boilingPointC,
  flash: (s) => s.flashPointC,
  guide: (s) => GUIDE_RANK[s.guideCategory],
};

export function sortSolvents(list: SolventListItem[], sort: Sort): SolventListItem[] {
  if (sort.by === "match") return list;
  const dir = sort.descending ? -1 : 1;
  const by = sort.by;
  return [...list].sort((a, b) => {
    if (by === "name") return dir * a.name.localeCompare(b.name);
    const va = SORT_VALUE[by](a);
    const vb = SORT_VALUE[by](b);
    if (va === null || vb === null) return va === vb ? 0 : va === null ? 1 : -1;
    return dir * (va - vb) || a.name.localeCompare(b.name);
  });
}

function GuideTag({ s }: { s: SolventListItem }) {
  const t = toneColors[GUIDE_TONE[s.guideCategory]];
  return (
    <View style={[styles.tag, { backgroundColor: colors[t.bg], borderColor: colors[t.fg] }]}>
      <Text size="caption" bold tone={t.fg} numberOfLines={1}>
        {GUIDE_LABEL[s.guideCategory]}
      </Text>
    </View>
  );
}

const flash = (s: SolventListItem) => (s.flashPointC === null ? "none" : `${trimNumber(s.flashPointC, 0)} °C`);

/** Phone: one large row per solvent; a tap opens its page. */
function SolventRow({ s, onOpen }: { s: SolventListItem; onOpen: () => void }) {
  const abbr = solventAbbreviation(s);
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={`${s.name}, ${s.densityGPerMl20C.toFixed(3)} g/mL, boils at ${trimNumber(s.boilingPointC, 1)} °C, ${GUIDE_LABEL[s.guideCategory]}`}
      onPress={onOpen}
      testID={`solvent-row-${s.key}`}
      style={({ pressed }) => [styles.row, pressed && styles.pressed]}
    >
      <View style={styles.rowMain}>
        <Text bold>{abbr ? `${s.name} (${abbr})` : s.name}</Text>
        <Text size="caption" tone="inkMuted">
          {`${s.densityGPerMl20C.toFixed(3)} g/mL · bp ${trimNumber(s.boilingPointC, 1)} °C · flash ${flash(s)} · ${MISCIBILITY_LABEL[s.miscibility].toLowerCase()}`}
        </Text>
      </View>
      <GuideTag s={s} />
    </Pressable>
  );
}

const COLUMNS: { key: Exclude<SortKey, "match">; label: string; width?: number; flex?: number; align?: "right" }[] = [
  { key: "name", label: "Solvent", flex: 1 },
  { key: "density", label: "Density", width: 96, align: "right" },
  { key: "bp", label: "bp °C", width: 76, align: "right" },
  { key: "flash", label: "Flash °C", width: 88, align: "right" },
  { key: "guide", label: "CHEM21", width: 148 },
];

/** Wide: a sortable table; a click shows the solvent in the pane beside it. */
function SolventTable({ list, sort, onSort, selected, onSelect }: { list: SolventListItem[]; sort: Sort; onSort: (k: SortKey) => void; selected: string | null; onSelect: (key: string) => void }) {
  const cell = (c: (typeof COLUMNS)[number]) => [styles.cell, c.width ? { width: c.width } : { flex: c.flex }, c.align === "right" && styles.right];
  return (
    <View style={styles.table} testID="solvent-table">
      <View style={[styles.tr, styles.th]}>
        {COLUMNS.map((c) => {
          const on = sort.by === c.key;
          return (
            <Pressable
              key={c.key}
              accessibilityRole="button"
              accessibilityLabel={`Sort by ${SORT_LABEL[c.key]}${on ? (sort.descending ? ", descending" : ", ascending") : ""}`}
              onPress={() => onSort(c.key)}
              style={cell(c)}
              testID={`sort-${c.key}`}
            >
              <Text bold size="label" tone={on ? "brand" : "ink"} align={c.align}>
                {`${c.label}${on ? (sort.descending ? " ↓" : " ↑") : ""}`}
              </Text>
            </Pressable>
          );
        })}
      </View>
      <ScrollView style={styles.tableBody} accessibilityRole="list">
        {list.map((s) => {
          const on = s.key === selected;
          const abbr = solventAbbreviation(s);
          return (
            <Pressable
              key={s.key}
              accessibilityRole="button"
              accessibilityState={{ selected: on }}
              accessibilityLabel={`${s.name}: show every value`}
              onPress={() => onSelect(s.key)}
              testID={`solvent-row-${s.key}`}
              style={({ pressed }) => [styles.tr, on && styles.trOn, pressed && styles.pressed]}
            >
              <View style={cell(COLUMNS[0]!)}>
                <Text bold={on} numberOfLines={1}>
                  {s.name}
                </Text>
                {abbr ? (
                  <Text size="caption" tone="inkMuted">
                    {abbr}
                  </Text>
                ) : null}
              </View>
              <Text style={cell(COLUMNS[1]!)}>{s.densityGPerMl20C.toFixed(3)}</Text>
              <Text style={cell(COLUMNS[2]!)}>{trimNumber(s.boilingPointC, 1)}</Text>
              <Text style={cell(COLUMNS[3]!)}>{s.flashPointC === null ? "none" : trimNumber(s.flashPointC, 0)}</Text>
              <View style={cell(COLUMNS[4]!)}>
                <GuideTag s={s} />
              </View>
            </Pressable>
          );
        })}
      </ScrollView>
    </View>
  );
}

/**
 * The solvent tables: fuzzy search (name, abbreviation, formula, CAS) and sorting; on a wide
 * screen a table with the chosen solvent beside it, on a phone a list that opens each solvent.
 */
export function SolventsScreen({ selectedKey }: { selectedKey?: string }) {
  const wide = useLayout() === "wide";
  const windowHeight = useWindowDimensions().height;
  const router = useRouter();
  const [text, setText] = useState("");
  const [q, setQ] = useState("");
  const [sort, setSort] = useState<Sort>({ by: "name", descending: false });
  const [selected, setSelected] = useState<string | null>(selectedKey ?? null);

  useEffect(() => {
    const id = setTimeout(() => setQ(text.trim()), SEARCH_DELAY_MS);
    return () => clearTimeout(id);
  }, [text]);
  // A search ranks by match until another order is chosen; clearing it goes back to names.
  useEffect(() => {
    setSort((s) => (q && s.by === "name" && !s.descending ? { by: "match", descending: false } : !q && s.by === "match" ? { by: "name", descending: false } : s));
  }, [q]);

  const list = useSolventsQuery(q);
  const rows = useMemo(() => sortSolvents(list.data?.solvents ?? [], sort), [list.data, sort]);

  const onSort = (by: SortKey) => setSort((s) => (s.by === by ? { by, descending: !s.descending } : { by, descending: false }));

  // A phone shows one solvent on its own page.
  if (!wide && selectedKey) {
    return (
      <Screen title="Solvent" actions={<Button label="All solvents" variant="secondary" onPress={() => router.push("/solvents")} testID="back-to-solvents" />}>
        <SolventDetailView solventKey={selectedKey} />
      </Screen>
    );
  }

  const search = (
    <Field
      label="Search solvents"
      value={text}
      onChangeText={setText}
      placeholder="Name, abbreviation, formula or CAS number"
      autoCapitalize="none"
      autoCorrect={false}
      testID="solvent-search"
    />
  );
  const body = list.isPending ? (
    <Loading label="Loading the solvent tables…" />
  ) : list.isError ? (
    <ErrorState error={list.error} onRetry={() => list.refetch()} />
  ) : rows.length === 0 ? (
    <Empty
      title="No solvent matches"
      body={`Nothing in the tables is like “${q}”. Try the full name, an abbreviation such as DCM, or the CAS number.`}
      action={<Button label="Clear the search" variant="secondary" onPress={() => setText("")} />}
    />
  ) : wide ? (
    <SolventTable list={rows} sort={sort} onSort={onSort} selected={selected} onSelect={setSelected} />
  ) : (
    <View style={styles.list} accessibilityRole="list">
      {rows.map((s) => (
        <SolventRow key={s.key} s={s} onOpen={() => router.push(`/solvents/${s.key}` as never)} />
      ))}
    </View>
  );
  const sortChoices = (q ? (["match"] as SortKey[]) : []).concat(["name", "density", "bp", "flash", "guide"]);
  const subtitle = `${list.data?.solvents.length ?? "…"} ${q ? "matching" : "in the tables"} · densities in g/mL at 20 °C · every value with its source`;

  if (wide) {
    // Both panes fit the window and scroll on their own, so the chosen solvent stays in view.
    return (
      <Screen title="Solvents" subtitle={subtitle} width="full" scroll={false}>
        <View style={[styles.panes, { height: Math.max(MIN_PANE_PX, windowHeight - PANE_TOP_PX) }]}>
          <View style={[styles.stack, styles.listPane]}>
            {search}
            {body}
          </View>
          <ScrollView style={styles.detailPane} contentContainerStyle={styles.stack}>
            {selected ? (
              <SolventDetailView solventKey={selected} />
            ) : (
              <Empty title="Choose a solvent" body="Click a row to see every value with its source and its CHEM21 category with the reason." />
            )}
          </ScrollView>
        </View>
      </Screen>
    );
  }
  return (
    <Screen title="Solvents" subtitle={subtitle}>
      {search}
      <Chips
        label="Sort by"
        showLabel
        scroll
        options={sortChoices.map((k) => ({ value: k, label: sort.by === k && k !== "match" ? `${SORT_LABEL[k]} ${sort.descending ? "↓" : "↑"}` : SORT_LABEL[k] }))}
        selected={sort.by}
        onSelect={(k) => onSort(k as SortKey)}
        testID="sort"
      />
      {body}
    </Screen>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg, paddingBottom: space.xl },
  list: { gap: space.sm },
  row: {
    flexDirection: "row",
    alignItems: "center",
    gap: space.sm,
    minHeight: 64,
    padding: space.md,
    borderRadius: radii.md,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
  },
  rowMain: { flex: 1, gap: 2 },
  pressed: { backgroundColor: colors.infoSoft },
  tag: { borderWidth: 1, borderRadius: radii.pill, paddingHorizontal: space.sm, paddingVertical: 2 },
  panes: { flexDirection: "row", gap: space.xl },
  listPane: { flex: 3, minWidth: 0 },
  detailPane: { flex: 2, minWidth: 0 },
  table: { flex: 1, minHeight: 0, backgroundColor: colors.surface, borderRadius: radii.md, borderWidth: 1, borderColor: colors.line, overflow: "hidden" },
  tableBody: { flex: 1 },
  tr: { flexDirection: "row", alignItems: "center", minHeight: TOUCH_MIN, borderBottomWidth: 1, borderBottomColor: colors.line },
  th: { backgroundColor: colors.paper },
  trOn: { backgroundColor: colors.infoSoft },
  cell: { paddingHorizontal: space.sm, paddingVertical: space.xs, justifyContent: "center", minHeight: TOUCH_MIN },
  right: { textAlign: "right", alignItems: "flex-end" },
});
