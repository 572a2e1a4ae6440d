import { ScrollView, StyleSheet, View } from "react-native";
import { SafeAreaView } from "react-native-safe-area-context";
import { COLUMN_MAX_PX, useLayout } from "../../hooks/breakpoints";
import { colors, space } from "../../hooks/theme";
import { Text } from "./text";

export interface ScreenProps {
  title: string;
  subtitle?: string;
  children: React.ReactNode;
  /** "column" centres one column on wide screens; "full" lets a two-pane layout use the width. */
  width?: "column" | "full";
  /** Content that stays put under the title (e.g. a search box). */
  scroll?: boolean;
  actions?: React.ReactNode;
}

/** Owns safe areas, scrolling and the wide-screen column. Every screen sits in one. */
export function Screen({ title, subtitle, children, width = "column", scroll = true, actions }: ScreenProps) {
  const layout = useLayout();
  const inner = (
    <View style={[styles.inner, width === "column" && layout === "wide" ? styles.column : null]}>
      <View style={styles.header}>
        <View style={styles.titles}>
          <Text size="headline" accessibilityRole="header">
            {title}
          </Text>
          {subtitle ? <Text tone="inkMuted">{subtitle}</Text> : null}
        </View>
        {actions ? <View style={styles.actions}>{actions}</View> : null}
      </View>
      {children}
    </View>
  );
  return (
    <SafeAreaView style={styles.safe} edges={layout === "wide" ? ["top", "bottom"] : ["top"]}>
      {scroll ? (
        <ScrollView contentContainerStyle={styles.scroll} keyboardShouldPersistTaps="handled">
          {inner}
        </ScrollView>
      ) : (
        <View style={styles.scroll}>{inner}</View>
      )}
    </SafeAreaView>
  );
}

const styles = StyleSheet.create({
  safe: { flex: 1, backgroundColor: colors.paper },
  scroll: { flexGrow: 1, padding: space.lg, paddingBottom: space.xxl },
  inner: { gap: space.lg, width: "100%" },
  column: { maxWidth: COLUMN_MAX_PX, alignSelf: "center" },
  header: { flexDirection: "row", flexWrap: "wrap", alignItems: "flex-end", justifyContent: "space-between", gap: space.md },
  titles: { flexShrink: 1, gap: space.xs },
  actions: { flexDirection: "row", gap: space.sm, flexWrap: "wrap" },
});
