import { ActivityIndicator, StyleSheet, View } from "react-native";
import { colors, space } from "../../hooks/theme";
import { Button } from "./button";
import { Notice } from "./notice";
import { Text } from "./text";

export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <View style={styles.center} accessibilityLabel={label} accessibilityRole="progressbar">
      <ActivityIndicator color={colors.brand} size="large" />
      <Text tone="inkMuted">{label}</Text>
    </View>
  );
}

export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const message = error instanceof Error ? error.message : "Something went wrong.";
  return (
    <Notice tone="danger" title="That did not load">
      <Text>{message}</Text>
      {onRetry ? <Button label="Try again" variant="secondary" onPress={onRetry} /> : null}
    </Notice>
  );
}

export function Empty({ title, body, action }: { title: string; body: string; action?: React.ReactNode }) {
  return (
    <View style={styles.empty}>
      <Text bold size="title">
        {title}
      </Text>
      <Text tone="inkMuted">{body}</Text>
      {action}
    </View>
  );
}

const styles = StyleSheet.create({
  center: { alignItems: "center", justifyContent: "center", padding: space.xl, gap: space.md },
  empty: { padding: space.xl, gap: space.md, alignItems: "flex-start" },
});
