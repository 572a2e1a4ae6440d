import { useState } from "react";
import { Pressable, StyleSheet, View } from "react-native";
import { colors, radii, space } from "../../hooks/theme";
import { Button } from "./button";
import { Field } from "./field";
import { Text } from "./text";

/** One row a picker can offer: the thing, how to show it, and what picking it implies. */
export interface PickerRow<T> {
  item: T;
  title: string;
  detail?: string;
  /** extra meaning of this row, handed back on pick (e.g. "saturated" for "Brine") */
  preset?: string;
}

export interface NamePickerProps<T extends { key: string }> {
  label: string;
  /** the chosen row, or null */
  chosen: PickerRow<T> | null;
  /** rows matching what was typed, best first */
  search: (query: string) => PickerRow<T>[];
  /** rows offered before anything is typed */
  common: PickerRow<T>[];
  onPick: (row: PickerRow<T>, typed: string) => void;
  placeholder: string;
  /** what to say when nothing matches */
  noMatch: (query: string) => string;
  /** a problem with the current choice, shown under it */
  error?: string;
  testID?: string;
}

/**
 * The shared body of the solvent and solute pickers: a chosen row with "Change", or a search
 * box over large result rows (≥ 56 px). Enter takes the first row. Not used directly by screens.
 */
export function NamePicker<T extends { key: string }>({ label, chosen, search, common, onPick, placeholder, noMatch, error, testID }: NamePickerProps<T>) {
  // Open while nothing is chosen, or after "Change"; a choice made elsewhere (a recent check) shows at once.
  const [editing, setEditing] = useState(false);
  const [query, setQuery] = useState("");
  const open = editing || chosen === null;
  const rows = query.trim() === "" ? common : search(query);

  const pick = (row: PickerRow<T>) => {
    onPick(row, query);
    setQuery("");
    setEditing(false);
  };

  const errorLine = error ? (
    <Text size="caption" tone="danger" accessibilityLiveRegion="polite">
      {error}
    </Text>
  ) : null;

  if (!open && chosen) {
    return (
      <View style={styles.wrap}>
        <Text bold size="label">
          {label}
        </Text>
        <View style={styles.chosen} testID={testID ? `${testID}-chosen` : undefined}>
          <View style={styles.rowText}>
            <Text bold size="title">
              {chosen.title}
            </Text>
            {chosen.detail ? <Text tone="inkMuted">{chosen.detail}</Text> : null}
          </View>
          <Button label="Change" variant="quiet" hint={`Choose another ${label.toLowerCase()}`} onPress={() => setEditing(true)} testID={testID ? `${testID}-change` : undefined} />
        </View>
        {errorLine}
      </View>
    );
  }

  return (
    <View style={styles.wrap}>
      <Field
        label={label}
        value={query}
        onChangeText={setQuery}
        placeholder={placeholder}
        error={error}
        autoCapitalize="none"
        autoCorrect={false}
        autoFocus={editing && chosen !== null}
        onSubmitEditing={() => rows[0] && pick(rows[0])}
        testID={testID ? `${testID}-search` : undefined}
      />
      <View accessibilityRole="list" style={styles.list}>
        {rows.length === 0 ? (
          <Text tone="inkMuted" accessibilityLiveRegion="polite">
            {noMatch(query)}
          </Text>
        ) : (
          rows.map((row) => (
            <Pressable
              key={`${row.item.key}-${row.preset ?? ""}`}
              accessibilityRole="button"
              accessibilityLabel={row.detail ? `${row.title}, ${row.detail}` : row.title}
              onPress={() => pick(row)}
              testID={testID ? `${testID}-option-${row.item.key}${row.preset ? `-${row.preset}` : ""}` : undefined}
              style={({ pressed }) => [styles.option, pressed && styles.pressed]}
            >
              <Text bold>{row.title}</Text>
              {row.detail ? (
                <Text size="caption" tone="inkMuted">
                  {row.detail}
                </Text>
              ) : null}
            </Pressable>
          ))
        )}
      </View>
      {chosen ? (
        <Button
          label={`Keep ${chosen.title}`}
          variant="quiet"
          onPress={() => {
            setQuery("");
            setEditing(false);
          }}
        />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  chosen: {
    flexDirection: "row",
    alignItems: "center",
    gap: space.sm,
    minHeight: 56,
    borderWidth: 2,
    borderColor: colors.line,
    borderRadius: radii.md,
    paddingLeft: space.md,
    backgroundColor: colors.surface,
  },
  rowText: { flex: 1, paddingVertical: space.sm },
  list: { gap: space.xs },
  option: {
    minHeight: 56,
    justifyContent: "center",
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    borderRadius: radii.md,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
  },
  pressed: { backgroundColor: colors.infoSoft },
});
