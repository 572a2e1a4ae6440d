import { StyleSheet, TextInput, View, type TextInputProps } from "react-native";
import { colors, fonts, radii, space, TOUCH_MIN, type as typeScale } from "../../hooks/theme";
import { Text } from "./text";

export interface FieldProps extends Omit<TextInputProps, "style"> {
  label: string;
  error?: string;
  help?: string;
}

/** A text input with its visible label, help and error line. */
export function Field({ label, error, help, testID, ...input }: FieldProps) {
  return (
    <View style={styles.wrap}>
      <Text bold size="label">
        {label}
      </Text>
      <TextInput
        {...input}
        testID={testID}
        accessibilityLabel={label}
        aria-invalid={error ? true : undefined}
        placeholderTextColor={colors.inkMuted}
        style={[styles.input, error ? styles.inputError : null]}
      />
      {error ? (
        <Text size="caption" tone="danger" accessibilityLiveRegion="polite">
          {error}
        </Text>
      ) : help ? (
        <Text size="caption" tone="inkMuted">
          {help}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  input: {
    minHeight: TOUCH_MIN,
    borderWidth: 2,
    borderColor: colors.line,
    borderRadius: radii.md,
    paddingHorizontal: space.md,
    backgroundColor: colors.surface,
    color: colors.ink,
    fontFamily: fonts.regular,
    ...typeScale.body,
  },
  inputError: { borderColor: colors.danger },
});
