import { useState } from "react";
import { Pressable, StyleSheet, TextInput, View } from "react-native";
import { PKA_TABLE, searchPka, type IonisableKind, type PkaEntry } from "../../knowledge/plan";
import { colors, fonts, radii, space, TOUCH_MIN, type as typeScale } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Text } from "../ui/text";

/** Short names of the pKa sources, for one line under a value. */
const SHORT_SOURCE: Record<string, string> = {
  "libretexts-e1-acid-constants": "CRC values, LibreTexts table E1",
  "libretexts-e5-martell-smith": "Martell & Smith, LibreTexts table E5",
  "reusch-basicity-table": "Reusch basicity table",
  "crc-inorganic-dissociation": "CRC inorganic dissociation constants",
  "from-memory": "from memory",
};

export const pkaSourceLabel = (source: string) => SHORT_SOURCE[source] ?? source;

export function pkaEntry(key: string | undefined): PkaEntry | undefined {
  return key ? PKA_TABLE.find((e) => e.key === key) : undefined;
}

/** "pyridine, pKa 5.2 (Reusch basicity table)" */
export function pkaLine(e: PkaEntry): string {
  const range = e.range ? `, family ${e.range[0]}–${e.range[1]}` : "";
  return `${e.name}: pKa ${e.pKa.value}${range} (${pkaSourceLabel(e.pKa.source)})`;
}

export interface PkaPickerProps {
  kind: IonisableKind;
  onPick: (entry: PkaEntry) => void;
  onClose: () => void;
  testID?: string;
}

/** Search the pKa table (names, abbreviations, functional groups) and take a value with its source. */
export function PkaPicker({ kind, onPick, onClose, testID }: PkaPickerProps) {
  const [query, setQuery] = useState("");
  const rows = searchPka(query, kind).slice(0, 8);
  const label = kind === "base" ? "Find a base (its conjugate acid's pKa)" : "Find an acid";
  return (
    <View style={styles.wrap} testID={testID}>
      <Text bold size="label">
        {label}
      </Text>
      <TextInput
        value={query}
        onChangeText={setQuery}
        placeholder={kind === "base" ? "pyridine, Et3N, aniline, amine…" : "acetic acid, phenol, carboxylic…"}
        placeholderTextColor={colors.inkMuted}
        accessibilityLabel={label}
        autoCapitalize="none"
        autoCorrect={false}
        autoFocus
        style={styles.input}
        testID={testID ? `${testID}-search` : undefined}
      />
      <View accessibilityRole="list" style={styles.list}>
        {rows.length === 0 ? (
          <Text tone="inkMuted">Nothing in the pKa table matches “{query}”. Type the value instead.</Text>
        ) : (
          rows.map((e) => (
            <Pressable
              key={e.key}
              accessibilityRole="button"
              accessibilityLabel={pkaLine(e)}
              onPress={() => onPick(e)}
              testID={testID ? `${testID}-option-${e.key}` : undefined}
              style={({ pressed }) => [styles.option, pressed && styles.pressed]}
            >
              <View style={styles.optionText}>
                <Text bold>{e.name}</Text>
                <Text size="caption" tone="inkMuted">
                  {e.group} · {pkaSourceLabel(e.pKa.source)}
                  {e.pKa.note ? ` · ${e.pKa.note}` : ""}
                </Text>
              </View>
              <Text bold size="title">
                {e.pKa.value}
              </Text>
            </Pressable>
          ))
        )}
      </View>
      <Button label="Close the table" variant="quiet" onPress={onClose} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, padding: space.sm, borderRadius: radii.md, backgroundColor: colors.paper },
  input: {
    minHeight: TOUCH_MIN,
    borderWidth: 2,
    borderColor: colors.focus,
    borderRadius: radii.md,
    paddingHorizontal: space.md,
    backgroundColor: colors.surface,
    color: colors.ink,
    fontFamily: fonts.regular,
    ...typeScale.body,
  },
  list: { gap: space.xs },
  option: {
    minHeight: 56,
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    borderRadius: radii.md,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.line,
  },
  optionText: { flex: 1 },
  pressed: { backgroundColor: colors.infoSoft },
});
