import { Pressable, StyleSheet } from "react-native";
import { space, TOUCH_MIN } from "../../hooks/theme";
import { Text } from "../ui/text";

/**
 * A pressable line of text that wraps (a case title, a search hit), where a Button's single
 * line would clip a long title on a phone.
 */
export function LinkRow({ label, detail, onPress, testID }: { label: string; detail?: string; onPress: () => void; testID?: string }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} onPress={onPress} style={({ pressed }) => [styles.row, pressed && styles.pressed]} testID={testID}>
      <Text bold tone="brand" style={styles.link}>
        {label}
      </Text>
      {detail ? (
        <Text size="caption" tone="inkMuted">
          {detail}
        </Text>
      ) : null}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: { minHeight: TOUCH_MIN, justifyContent: "center", paddingVertical: space.xs, gap: 2 },
  pressed: { opacity: 0.7 },
  link: { textDecorationLine: "underline" },
});
