import { ActivityIndicator, Pressable, StyleSheet, View } from "react-native";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { Text } from "./text";

type Variant = "primary" | "secondary" | "quiet" | "danger";

const look: Record<Variant, { bg: string; fg: "brandInk" | "brand" | "danger"; border: string }> = {
  primary: { bg: colors.brand, fg: "brandInk", border: colors.brand },
  secondary: { bg: colors.surface, fg: "brand", border: colors.brand },
  quiet: { bg: "transparent", fg: "brand", border: "transparent" },
  danger: { bg: colors.surface, fg: "danger", border: colors.danger },
};

export interface ButtonProps {
  label: string;
  onPress?: () => void;
  variant?: Variant;
  disabled?: boolean;
  busy?: boolean;
  /** Accessible hint when the label alone is not enough. */
  hint?: string;
  testID?: string;
  grow?: boolean;
}

export function Button({ label, onPress, variant = "primary", disabled, busy, hint, testID, grow }: ButtonProps) {
  const l = look[variant];
  const inactive = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityHint={hint}
      accessibilityState={{ disabled: !!inactive, busy: !!busy }}
      disabled={inactive}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [
        styles.base,
        { backgroundColor: l.bg, borderColor: l.border, opacity: inactive ? 0.5 : pressed ? 0.8 : 1 },
        grow && styles.grow,
      ]}
    >
      <View style={styles.row}>
        {busy ? <ActivityIndicator color={variant === "primary" ? colors.brandInk : colors.brand} /> : null}
        <Text bold size="label" tone={l.fg}>
          {label}
        </Text>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: TOUCH_MIN,
    minWidth: TOUCH_MIN,
    paddingHorizontal: space.lg,
    borderRadius: radii.md,
    borderWidth: 2,
    alignItems: "center",
    justifyContent: "center",
  },
  grow: { flexGrow: 1 },
  row: { flexDirection: "row", alignItems: "center", gap: space.sm },
});
