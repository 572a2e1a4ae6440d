import { useState } from "react";
import { StyleSheet, View } from "react-native";
import type { TroubleshootResponse } from "../../knowledge/contracts/emulsion";
import { colors, radii, space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { RemedyCard, capitalise } from "./remedy-card";
import { layersDetail, layersLine, likelihoodText, splitRemedies } from "./wording";

/** Causes below this likelihood are not listed (the knowledge module's "likely" line). */
const CAUSE_SHOWN = 0.2;
const FIRST_REMEDIES = 5;
const FIRST_TIPS = 4;

export type Provenance = "local" | "checking" | "group" | "group-none" | "offline";

const PROVENANCE: Record<Provenance, { text: string; tone: "inkMuted" | "good" | "caution" }> = {
  local: { text: "Ranked on this device from the shipped tables.", tone: "inkMuted" },
  checking: { text: "Ranked on this device; checking your group's cases…", tone: "inkMuted" },
  group: { text: "Includes your group's logged cases on similar systems.", tone: "good" },
  "group-none": { text: "Your group has no logged cases on similar systems yet.", tone: "inkMuted" },
  offline: { text: "No connection: ranked on this device, without your group's cases.", tone: "caution" },
};

interface Props {
  answer: TroubleshootResponse;
  provenance: Provenance;
  /** "Start a case" and friends */
  actions?: React.ReactNode;
}

/** Causes first, then remedies to try in order, those ruled out, and what to do next time. */
export function EmulsionResults({ answer, provenance, actions }: Props) {
  const [allRemedies, setAllRemedies] = useState(false);
  const [allTips, setAllTips] = useState(false);
  const { open, blocked } = splitRemedies(answer);
  const causes = answer.causes.filter((c) => c.score >= CAUSE_SHOWN).slice(0, 3);
  const shown = allRemedies ? open : open.slice(0, FIRST_REMEDIES);
  const tips = allTips ? answer.prevention : answer.prevention.slice(0, FIRST_TIPS);
  const p = PROVENANCE[provenance];
  const warnings = answer.layers.warnings ?? [];

  return (
    <View style={styles.wrap} testID="emulsion-results">
      <Card>
        <Text bold size="title" testID="emulsion-layers">
          {layersLine(answer.layers)}
        </Text>
        <Text tone="inkMuted">{layersDetail(answer.layers)}</Text>
        {warnings.slice(0, 2).map((w) => (
          <Notice key={w.code} tone="caution">
            {w.message}
          </Notice>
        ))}
        <Text size="caption" tone={p.tone} testID="emulsion-provenance">
          {p.text}
        </Text>
        {actions}
      </Card>

      <View style={styles.section}>
        <Text bold size="headline" accessibilityRole="header">
          Likely causes
        </Text>
        {causes.length === 0 ? (
          <Text tone="inkMuted">Nothing points to one cause: start with the cheap, safe remedies.</Text>
        ) : (
          causes.map((c) => (
            <View key={c.code} style={styles.cause} testID={`cause-${c.code}`}>
              <View style={styles.pct} accessibilityLabel={`${likelihoodText(c.score)} likely`}>
                <Text bold size="label">
                  {likelihoodText(c.score)}
                </Text>
              </View>
              <View style={styles.grow}>
                <Text bold>{c.title}</Text>
                <Text tone="inkMuted">{capitalise(c.reasons.slice(0, 2).join("; "))}</Text>
              </View>
            </View>
          ))
        )}
      </View>

      <View style={styles.section}>
        <Text bold size="headline" accessibilityRole="header">
          Try in this order
        </Text>
        {shown.map((r, i) => (
          <RemedyCard key={r.id} remedy={r} rank={i + 1} />
        ))}
        {open.length > FIRST_REMEDIES ? (
          <Button
            label={allRemedies ? "Show fewer" : `Show ${open.length - FIRST_REMEDIES} more`}
            variant="quiet"
            onPress={() => setAllRemedies(!allRemedies)}
            testID="emulsion-more-remedies"
          />
        ) : null}
      </View>

      {blocked.length > 0 ? (
        <View style={styles.section} testID="emulsion-ruled-out">
          <Text bold size="headline" accessibilityRole="header">
            Not for this funnel
          </Text>
          {blocked.map(({ remedy, warning }) => (
            <RemedyCard key={remedy.id} remedy={remedy} warning={warning} />
          ))}
        </View>
      ) : null}

      <View style={styles.section}>
        <Text bold size="headline" accessibilityRole="header">
          Next time
        </Text>
        <Card testID="emulsion-prevention">
          {tips.map((t) => (
            <View key={t} style={styles.tip}>
              <Text tone="inkMuted">•</Text>
              <Text style={styles.grow}>{t}</Text>
            </View>
          ))}
          {answer.prevention.length > FIRST_TIPS ? (
            <Button label={allTips ? "Fewer tips" : "All tips"} variant="quiet" onPress={() => setAllTips(!allTips)} />
          ) : null}
        </Card>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xl },
  section: { gap: space.md },
  cause: { flexDirection: "row", gap: space.md, alignItems: "flex-start" },
  pct: {
    minWidth: 64,
    paddingVertical: space.xs,
    paddingHorizontal: space.sm,
    borderRadius: radii.sm,
    backgroundColor: colors.cautionSoft,
    alignItems: "center",
  },
  grow: { flexGrow: 1, flexShrink: 1 },
  tip: { flexDirection: "row", gap: space.sm },
});
