import { StyleSheet, View } from "react-native";
import { colors, radii, space, toneColors, type Tone } from "../../hooks/theme";
import type { AttemptOutcome, CaseStatus } from "../../knowledge/contracts/cases";
import { Text } from "../ui/text";
import { OUTCOME, STATUS } from "./vocab";

/** A short label on its tone's colour; the text carries the meaning, the colour repeats it. */
export function Pill({ tone, label, testID }: { tone: Tone; label: string; testID?: string }) {
  const t = toneColors[tone];
  return (
    <View style={[styles.pill, { backgroundColor: colors[t.bg], borderColor: colors[t.fg] }]} testID={testID}>
      <Text size="caption" bold tone={t.fg}>
        {label}
      </Text>
    </View>
  );
}

export function OutcomePill({ outcome, testID }: { outcome: AttemptOutcome; testID?: string }) {
  const o = OUTCOME[outcome];
  return <Pill tone={o.tone} label={`${o.mark} ${o.label}`} testID={testID} />;
}

export function StatusPill({ status }: { status: CaseStatus }) {
  const s = STATUS[status];
  return <Pill tone={s.tone} label={s.label} />;
}

const styles = StyleSheet.create({
  pill: { borderWidth: 1, borderRadius: radii.pill, paddingHorizontal: space.sm, paddingVertical: 2, alignSelf: "flex-start" },
});
