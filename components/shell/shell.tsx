import { Link, usePathname } from "expo-router";
import { Pressable, StyleSheet, View } from "react-native";
import { useSafeAreaInsets } from "react-native-safe-area-context";
import { useLayout } from "../../hooks/breakpoints";
import { colors, space, TOUCH_MIN } from "../../hooks/theme";
import { useActiveGroup } from "../../hooks/use-me";
import { Icon } from "../ui/icon";
import { Mark } from "../ui/mark";
import { Text } from "../ui/text";
import { NAV_ITEMS, type NavItem } from "./nav-items";

function isActive(item: NavItem, pathname: string): boolean {
  return item.match === "/" ? pathname === "/" : pathname === item.match || pathname.startsWith(`${item.match}/`);
}

function NavLink({ item, active, wide }: { item: NavItem; active: boolean; wide: boolean }) {
  return (
    <Link href={item.href as never} asChild>
      <Pressable
        accessibilityRole="link"
        accessibilityLabel={item.label}
        accessibilityState={{ selected: active }}
        testID={`nav-${item.label.toLowerCase()}`}
        // Link's asChild slot hands style to the DOM as-is: give it one flat object.
        style={StyleSheet.flatten([wide ? styles.railItem : styles.tabItem, active && (wide ? styles.railActive : styles.tabActive)])}
      >
        <Icon name={item.icon} tone={active ? "brand" : "inkMuted"} />
        <Text size={wide ? "label" : "caption"} bold={active} tone={active ? "brand" : "inkMuted"} numberOfLines={1}>
          {item.label}
        </Text>
      </Pressable>
    </Link>
  );
}

/** Bottom tabs on a phone, a side rail on a wide screen; the URLs are the same. */
export function Shell({ children }: { children: React.ReactNode }) {
  const layout = useLayout();
  const pathname = usePathname();
  const insets = useSafeAreaInsets();
  const group = useActiveGroup();
  if (layout === "wide") {
    return (
      <View style={styles.wideRoot}>
        <View style={styles.rail} role="navigation" testID="side-rail">
          <View style={styles.brand}>
            <Mark size={36} />
            <View>
              <Text bold size="title" tone="brand">
                Phasewise
              </Text>
              {group ? (
                <Text size="caption" tone="inkMuted" numberOfLines={1}>
                  {group.name}
                </Text>
              ) : null}
            </View>
          </View>
          {NAV_ITEMS.map((item) => (
            <NavLink key={item.href} item={item} active={isActive(item, pathname)} wide />
          ))}
        </View>
        <View style={styles.content}>{children}</View>
      </View>
    );
  }
  return (
    <View style={styles.phoneRoot}>
      <View style={styles.content}>{children}</View>
      <View style={[styles.tabs, { paddingBottom: Math.max(insets.bottom, space.xs) }]} accessibilityRole="tablist" testID="tab-bar">
        {NAV_ITEMS.filter((item) => item.phoneTab).map((item) => (
          <NavLink key={item.href} item={item} active={isActive(item, pathname)} wide={false} />
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: "row", backgroundColor: colors.paper },
  phoneRoot: { flex: 1, backgroundColor: colors.paper },
  content: { flex: 1 },
  rail: {
    width: 232,
    backgroundColor: colors.surface,
    borderRightWidth: 1,
    borderRightColor: colors.line,
    paddingVertical: space.lg,
    paddingHorizontal: space.md,
    gap: space.xs,
  },
  brand: { flexDirection: "row", alignItems: "center", gap: space.sm, paddingHorizontal: space.sm, paddingBottom: space.lg },
  railItem: {
    flexDirection: "row",
    alignItems: "center",
    gap: space.md,
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.md,
    borderRadius: 10,
  },
  railActive: { backgroundColor: colors.infoSoft },
  tabs: {
    flexDirection: "row",
    backgroundColor: colors.surface,
    borderTopWidth: 1,
    borderTopColor: colors.line,
    paddingTop: space.xs,
  },
  tabItem: { flex: 1, alignItems: "center", justifyContent: "center", minHeight: 56, gap: 2, borderTopWidth: 3, borderTopColor: "transparent" },
  tabActive: { borderTopColor: colors.brand },
});
