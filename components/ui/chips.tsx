import { Pressable, ScrollView, StyleSheet, View } from "react-native";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { Text } from "./text";

export interface ChipOption<V extends string = string> {
  value: V;
  /** what the chip shows; the value when absent */
  label?: string;
}

export interface ChipsProps<V extends string = string> {
  /** names the group for screen readers (and is shown above the chips with `showLabel`) */
  label: string;
  /** plain strings or { value, label } */
  options: readonly (V | ChipOption<V>)[];
  /** the highlighted chip, if any */
  selected?: V | null;
  onSelect: (value: V) => void;
  showLabel?: boolean;
  /** one line that scrolls sideways instead of wrapping (for long lists on a phone) */
  scroll?: boolean;
  /** each chip gets `${testID}-${value}` */
  testID?: string;
}

const asOption = <V extends string>(o: V | ChipOption<V>): ChipOption<V> => (typeof o === "string" ? { value: o } : o);

/**
 * A row of large selectable chips (≥ 48 px, gloved hands): quick picks under a field, sort
 * keys, recent items. Pressing a chip reports its value; the caller decides what is selected.
 */
export function Chips<V extends string = string>({ label, options, selected, onSelect, showLabel, scroll, testID }: ChipsProps<V>) {
  const chips = options.map(asOption).map((o) => {
    const on = o.value === selected;
    return (
      <Pressable
        key={o.value}
        accessibilityRole="button"
        accessibilityState={{ selected: on }}
        accessibilityLabel={o.label ?? o.value}
        testID={testID ? `${testID}-${o.value}` : undefined}
        onPress={() => onSelect(o.value)}
        style={({ pressed }) => [styles.chip, on && styles.chipOn, pressed && styles.pressed]}
      >
        <Text size="label" bold={on} tone={on ? "brandInk" : "ink"} numberOfLines={1}>
          {o.label ?? o.value}
        </Text>
      </Pressable>
    );
  });
  return (
    <View style={styles.wrap} accessibilityLabel={label} testID={testID}>
      {showLabel ? (
        <Text bold size="label">
          {label}
        </Text>
      ) : null}
      {scroll ? (
        <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.line}>
          {chips}
        </ScrollView>
      ) : (
        <View style={styles.row}>{chips}</View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  line: { flexDirection: "row", gap: space.sm, paddingVertical: 2 },
  chip: {
    minHeight: TOUCH_MIN,
    minWidth: TOUCH_MIN,
    paddingHorizontal: space.md,
    borderRadius: radii.pill,
    borderWidth: 2,
    borderColor: colors.line,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  chipOn: { backgroundColor: colors.brand, borderColor: colors.brand },
  pressed: { opacity: 0.75 },
});
