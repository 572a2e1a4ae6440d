import { Pressable, ScrollView, StyleSheet, View } from "react-native";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { Text } from "../ui/text";

export interface Choice<V extends string> {
  value: V;
  label: string;
}

/** One large tap target that is on or off. */
export function Chip({
  label,
  on,
  onPress,
  role = "button",
  shape = "pill",
  testID,
}: {
  label: string;
  on: boolean;
  onPress: () => void;
  role?: "button" | "radio" | "checkbox";
  shape?: "pill" | "square";
  testID?: string;
}) {
  const state = role === "button" ? { selected: on } : { checked: on };
  return (
    <Pressable
      accessibilityRole={role}
      accessibilityState={state}
      accessibilityLabel={label}
      testID={testID}
      onPress={onPress}
      style={[styles.chip, shape === "square" && styles.square, on && styles.chipOn]}
    >
      <Text size="label" bold={on} tone={on ? "brandInk" : "ink"}>
        {role === "checkbox" && on ? `✓ ${label}` : label}
      </Text>
    </Pressable>
  );
}

interface Props<V extends string> {
  label: string;
  choices: readonly Choice<V>[];
  /** one value, or none */
  value: V | null | undefined;
  onChange: (v: V | null) => void;
  /** a second tap on the chosen chip clears it */
  allowNone?: boolean;
  /** one line that scrolls sideways, for long lists on a phone */
  scroll?: boolean;
  testID?: string;
}

/** A row of large tap targets for picking one of a few values (gloved hands, no dropdowns). */
export function ChoiceChips<V extends string>({ label, choices, value, onChange, allowNone = true, scroll, testID }: Props<V>) {
  const chips = choices.map((c) => {
    const on = c.value === value;
    return (
      <Chip
        key={c.value}
        role="radio"
        label={c.label}
        on={on}
        onPress={() => onChange(on && allowNone ? null : c.value)}
        testID={testID ? `${testID}-${c.value}` : undefined}
      />
    );
  });
  return (
    <View style={styles.wrap} accessibilityRole="radiogroup" accessibilityLabel={label}>
      <Text bold size="label">
        {label}
      </Text>
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

/** Chips where several may be on at once (observations, tags). */
export function ToggleChips<V extends string>({
  label,
  choices,
  values,
  onChange,
  testID,
}: {
  label: string;
  choices: readonly Choice<V>[];
  values: readonly V[];
  onChange: (v: V[]) => void;
  testID?: string;
}) {
  return (
    <View style={styles.wrap} accessibilityLabel={label}>
      <Text bold size="label">
        {label}
      </Text>
      <View style={styles.row}>
        {choices.map((c) => {
          const on = values.includes(c.value);
          return (
            <Chip
              key={c.value}
              role="checkbox"
              label={c.label}
              on={on}
              onPress={() => onChange(on ? values.filter((x) => x !== c.value) : [...values, c.value])}
              testID={testID ? `${testID}-${c.value}` : undefined}
            />
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  line: { flexDirection: "row", gap: space.sm, paddingVertical: 2 },
  chip: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.lg,
    borderRadius: radii.pill,
    borderWidth: 2,
    borderColor: colors.line,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  square: { borderRadius: radii.md, paddingHorizontal: space.sm, minWidth: TOUCH_MIN },
  chipOn: { backgroundColor: colors.brand, borderColor: colors.brand },
});
