import { StyleSheet, View } from "react-native";
import { colors, space } from "../../hooks/theme";
import { Card } from "../ui/card";
import { Mark } from "../ui/mark";
import { Screen } from "../ui/screen";
import { Text } from "../ui/text";

/** The frame around sign-in and sign-up: the mark, one line on what Phasewise does, the form. */
export function AuthFrame({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <Screen title="Phasewise" subtitle="Know your layers before you open the stopcock.">
      <View style={styles.brand}>
        <Mark size={56} />
      </View>
      <Card style={styles.card}>
        <Text size="title" bold accessibilityRole="header">
          {title}
        </Text>
        {children}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  brand: { alignItems: "flex-start" },
  card: { maxWidth: 460, width: "100%", borderColor: colors.line, gap: space.lg },
});
