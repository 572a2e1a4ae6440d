import { Link, useLocalSearchParams } from "expo-router";
import { Pressable, ScrollView, StyleSheet, View } from "react-native";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { useActiveGroup, useMeQuery, type GroupRole } from "../../hooks/use-me";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { DESK_SECTIONS, deskSection } from "./desk-sections";

const RANK: Record<GroupRole, number> = { owner: 3, lead: 2, chemist: 1 };

function Tabs({ current }: { current: string }) {
  return (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.tabs} accessibilityRole="tablist">
      {DESK_SECTIONS.map((s) => {
        const selected = s.key === current;
        return (
          <Link key={s.key} href={`/desk/${s.key}` as never} asChild>
            <Pressable
              accessibilityRole="tab"
              accessibilityState={{ selected }}
              accessibilityLabel={s.label}
              testID={`desk-tab-${s.key}`}
              // Link's asChild slot hands style to the DOM as-is: one flat object.
              style={StyleSheet.flatten([styles.tab, selected && styles.tabSelected])}
            >
              <Text bold size="label" tone={selected ? "brandInk" : "brand"} numberOfLines={1}>
                {s.label}
              </Text>
            </Pressable>
          </Link>
        );
      })}
    </ScrollView>
  );
}

/** The lead's desk: one tab per entry of DESK_SECTIONS. Everyone may look; the server enforces who may act. */
export function DeskScreen() {
  const { section: key } = useLocalSearchParams<{ section?: string }>();
  const me = useMeQuery();
  const group = useActiveGroup();
  const section = deskSection(typeof key === "string" ? key : undefined);
  if (me.isPending) return <Screen title="Desk"><Loading /></Screen>;
  if (me.isError) return <Screen title="Desk"><ErrorState error={me.error} onRetry={() => me.refetch()} /></Screen>;
  if (!group) {
    return (
      <Screen title="Desk">
        <Empty title="No group yet" body="The desk curates a lab group's shared record. Start a group on the Group screen, or accept an invitation." />
      </Screen>
    );
  }
  const canAct = RANK[group.role] >= RANK[section.actsFrom];
  const Section = section.component;
  return (
    <Screen title="Desk" subtitle={`${group.name} · ${section.summary}`} width="full">
      <Tabs current={section.key} />
      {canAct ? null : (
        <Notice tone="info" title="Read-only for chemists" testID="desk-read-only">
          You can look at everything here; changes are made by a lead or an owner of the group.
        </Notice>
      )}
      <View style={styles.body}>
        <Section group={group} canAct={canAct} />
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  tabs: { gap: space.sm, paddingVertical: space.xs },
  tab: {
    minHeight: TOUCH_MIN,
    paddingHorizontal: space.lg,
    borderRadius: radii.pill,
    borderWidth: 2,
    borderColor: colors.brand,
    backgroundColor: colors.surface,
    alignItems: "center",
    justifyContent: "center",
  },
  tabSelected: { backgroundColor: colors.brand },
  body: { gap: space.lg },
});
