import { useMemo, useState, type ReactNode } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { useLayout } from "../../hooks/breakpoints";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { Text } from "../ui/text";

export interface Column<T> {
  key: string;
  title: string;
  render: (row: T) => ReactNode;
  /** makes the column sortable */
  sortValue?: (row: T) => string | number;
  /** relative width on wide screens (flex); 1 by default */
  flex?: number;
}

export interface DataTableProps<T> {
  /** names the table for screen readers */
  label: string;
  rows: T[];
  columns: Column<T>[];
  rowKey: (row: T) => string;
  initialSort?: { key: string; direction: "asc" | "desc" };
  /** extra content under a row (actions, details), on both layouts */
  below?: (row: T) => ReactNode;
  testID?: string;
}

/** A sortable table on a wide screen; on a phone the same rows as stacked cards (label: value). */
export function DataTable<T>({ label, rows, columns, rowKey, initialSort, below, testID }: DataTableProps<T>) {
  const layout = useLayout();
  const [sort, setSort] = useState(initialSort);
  const sorted = useMemo(() => {
    const col = columns.find((c) => c.key === sort?.key);
    if (!col?.sortValue || !sort) return rows;
    const value = col.sortValue;
    const sign = sort.direction === "asc" ? 1 : -1;
    return [...rows].sort((a, b) => {
      const x = value(a);
      const y = value(b);
      return (x < y ? -1 : x > y ? 1 : 0) * sign;
    });
  }, [rows, columns, sort]);

  if (layout === "phone") {
    return (
      <View style={styles.cards} accessibilityLabel={label} testID={testID}>
        {sorted.map((row) => (
          <View key={rowKey(row)} style={styles.card} testID={testID ? `${testID}-row` : undefined}>
            {columns.map((c) => (
              <View key={c.key} style={styles.pair}>
                <Text size="caption" bold tone="inkMuted">
                  {c.title}
                </Text>
                <View style={styles.pairValue}>{cell(c.render(row))}</View>
              </View>
            ))}
            {below ? below(row) : null}
          </View>
        ))}
      </View>
    );
  }

  const toggle = (key: string) =>
    setSort((s) => (s?.key === key ? { key, direction: s.direction === "asc" ? "desc" : "asc" } : { key, direction: "asc" }));
  return (
    <View style={styles.table} accessibilityLabel={label} role="table" testID={testID}>
      <View style={[styles.row, styles.head]} role="row">
        {columns.map((c) => {
          const active = sort?.key === c.key;
          const arrow = active ? (sort?.direction === "asc" ? " ▲" : " ▼") : "";
          return (
            <View key={c.key} style={[styles.cell, { flex: c.flex ?? 1 }]} role="columnheader">
              {c.sortValue ? (
                <Pressable
                  accessibilityRole="button"
                  accessibilityLabel={`Sort by ${c.title}${active ? (sort?.direction === "asc" ? ", ascending" : ", descending") : ""}`}
                  onPress={() => toggle(c.key)}
                  style={styles.sortButton}
                  testID={testID ? `${testID}-sort-${c.key}` : undefined}
                >
                  <Text bold size="label" tone="brand">
                    {c.title}
                    {arrow}
                  </Text>
                </Pressable>
              ) : (
                <View style={styles.sortButton}>
                  <Text bold size="label">
                    {c.title}
                  </Text>
                </View>
              )}
            </View>
          );
        })}
      </View>
      {sorted.map((row) => (
        <View key={rowKey(row)} style={styles.bodyRow} testID={testID ? `${testID}-row` : undefined}>
          <View style={styles.row} role="row">
            {columns.map((c) => (
              <View key={c.key} style={[styles.cell, { flex: c.flex ?? 1 }]} role="cell">
                {cell(c.render(row))}
              </View>
            ))}
          </View>
          {below ? <View style={styles.below}>{below(row)}</View> : null}
        </View>
      ))}
    </View>
  );
}

const cell = (v: ReactNode) => (typeof v === "string" || typeof v === "number" ? <Text>{v}</Text> : v);

const styles = StyleSheet.create({
  table: { borderWidth: 1, borderColor: colors.line, borderRadius: radii.md, backgroundColor: colors.surface, overflow: "hidden" },
  head: { backgroundColor: colors.paper, borderBottomWidth: 1, borderBottomColor: colors.line },
  row: { flexDirection: "row", alignItems: "flex-start" },
  bodyRow: { borderBottomWidth: 1, borderBottomColor: colors.line },
  cell: { padding: space.sm, gap: space.xs, minWidth: 0 },
  sortButton: { minHeight: TOUCH_MIN - 8, justifyContent: "center" },
  below: { paddingHorizontal: space.sm, paddingBottom: space.sm },
  cards: { gap: space.md },
  card: { backgroundColor: colors.surface, borderRadius: radii.md, borderWidth: 1, borderColor: colors.line, padding: space.md, gap: space.sm },
  pair: { gap: 2 },
  pairValue: { gap: space.xs },
});
