import { Pressable, StyleSheet, View } from "react-native";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { Chips } from "../ui/chips";
import { Text } from "../ui/text";

export interface Choice<V extends string> {
  value: V;
  label: string;
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
  /** each chip gets `${testID}-${value}` */
  testID?: string;
}

/** Pick one of a few values with large chips (gloved hands, no dropdowns); a second tap clears. */
export function ChoiceChips<V extends string>({ label, choices, value, onChange, allowNone = true, scroll, testID }: Props<V>) {
  return (
    <Chips
      label={label}
      showLabel
      options={choices}
      selected={value ?? null}
      onSelect={(v) => onChange(v === value && allowNone ? null : v)}
      scroll={scroll}
      testID={testID}
    />
  );
}

/** Chips where several may be on at once (observations, tags, causes): each is a checkbox. */
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
            <Pressable
              key={c.value}
              accessibilityRole="checkbox"
              accessibilityState={{ checked: on }}
              accessibilityLabel={c.label}
              testID={testID ? `${testID}-${c.value}` : undefined}
              onPress={() => onChange(on ? values.filter((x) => x !== c.value) : [...values, c.value])}
              style={[styles.chip, on && styles.chipOn]}
            >
              <Text size="label" bold={on} tone={on ? "brandInk" : "ink"}>
                {on ? `✓ ${c.label}` : c.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  // Square-cornered, unlike the single-choice pills, so "several allowed" reads at a glance.
  chip: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.md,
    borderRadius: radii.sm,
    borderWidth: 2,
    borderColor: colors.line,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  chipOn: { backgroundColor: colors.brand, borderColor: colors.brand },
});
