import { Link } from "expo-router";
import { Pressable, StyleSheet, View } from "react-native";
import { authClient } from "../../hooks/auth-client";
import { colors, radii, space, TOUCH_MIN } from "../../hooks/theme";
import { useActiveGroup, useMeQuery } from "../../hooks/use-me";
import { useQueryClient } from "@tanstack/react-query";
import { Button } from "../ui/button";
import { Icon } from "../ui/icon";
import { Screen } from "../ui/screen";
import { Text } from "../ui/text";
import { NAV_ITEMS } from "./nav-items";

/** Start page: who and where you are, and one tap to each area. */
export function HomeScreen() {
  const me = useMeQuery();
  const group = useActiveGroup();
  const qc = useQueryClient();
  const areas = NAV_ITEMS.filter((i) => i.href !== "/");
  return (
    <Screen
      title={me.data ? `Hello, ${me.data.user.name.split(" ")[0]}` : "Phasewise"}
      subtitle={group ? `Working in ${group.name}` : "Not in a lab group yet"}
      actions={
        <Button
          variant="secondary"
          label="Sign out"
          testID="sign-out"
          onPress={async () => {
            await authClient.signOut();
            qc.clear();
          }}
        />
      }
    >
      <View style={styles.grid}>
        {areas.map((a) => (
          <Link key={a.href} href={a.href as never} asChild>
            <Pressable accessibilityRole="link" accessibilityLabel={a.label} style={styles.tile} testID={`home-${a.label.toLowerCase()}`}>
              <Icon name={a.icon} tone="brand" size={28} />
              <Text bold size="title">
                {a.label}
              </Text>
            </Pressable>
          </Link>
        ))}
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: "row", flexWrap: "wrap", gap: space.md },
  tile: {
    minHeight: TOUCH_MIN * 2,
    minWidth: 150,
    flexGrow: 1,
    flexBasis: 150,
    backgroundColor: colors.surface,
    borderColor: colors.line,
    borderWidth: 1,
    borderRadius: radii.lg,
    padding: space.lg,
    gap: space.sm,
    justifyContent: "center",
  },
});
