import { StyleSheet, View } from "react-native";
import { colors, radii, space, toneColors, type Tone } from "../../hooks/theme";
import { Text } from "./text";

export interface NoticeProps {
  tone?: Tone;
  title?: string;
  children?: React.ReactNode;
  testID?: string;
}

/** A short message in a tone: caution, danger, info, good. */
export function Notice({ tone = "info", title, children, testID }: NoticeProps) {
  const t = toneColors[tone];
  return (
    <View
      testID={testID}
      accessibilityRole={tone === "danger" ? "alert" : undefined}
      style={[styles.box, { backgroundColor: colors[t.bg], borderLeftColor: colors[t.fg] }]}
    >
      {title ? (
        <Text bold tone={t.fg}>
          {title}
        </Text>
      ) : null}
      {typeof children === "string" ? <Text>{children}</Text> : children}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderLeftWidth: 5, borderRadius: radii.sm, padding: space.md, gap: space.xs },
});
