import { useState } from "react";
import { StyleSheet, View } from "react-native";
import type { RemedyAnswer } from "../../knowledge/contracts/emulsion";
import { colors, radii, space } from "../../hooks/theme";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Notice } from "../ui/notice";
import { Text } from "../ui/text";
import { afterLine, evidenceText, minutesText } from "./wording";

const EVIDENCE_LEVEL: Record<RemedyAnswer["evidenceLevel"], string> = {
  literature: "published methods and textbooks",
  "common-practice": "common practice",
  anecdotal: "bench lore",
};

function Lines({ title, lines, numbered }: { title: string; lines: string[]; numbered?: boolean }) {
  if (lines.length === 0) return null;
  return (
    <View style={styles.block}>
      <Text bold size="label">
        {title}
      </Text>
      {lines.map((l, i) => (
        <View key={`${i}-${l}`} style={styles.line}>
          <Text tone="inkMuted" style={styles.marker}>
            {numbered ? `${i + 1}.` : "•"}
          </Text>
          <Text style={styles.grow}>{l}</Text>
        </View>
      ))}
    </View>
  );
}

interface Props {
  remedy: RemedyAnswer;
  /** 1, 2, 3… for remedies to try; absent for one that is ruled out */
  rank?: number;
  /** why this remedy must not be used here */
  warning?: string;
}

/** One remedy: time, the main risk and what the layers do afterwards at a glance; steps and sources folded. */
export function RemedyCard({ remedy: r, rank, warning }: Props) {
  const [open, setOpen] = useState(false);
  const id = `remedy-${r.id}`;
  return (
    <Card testID={id} style={warning ? styles.ruledOut : undefined}>
      <View style={styles.head}>
        {rank !== undefined ? (
          <View style={styles.rank} accessibilityLabel={`Number ${rank}`}>
            <Text bold tone="brandInk">
              {rank}
            </Text>
          </View>
        ) : null}
        <Text bold size="title" style={styles.grow} accessibilityRole="header">
          {r.title}
        </Text>
        <Text bold size="label" tone="inkMuted" testID={`${id}-minutes`}>
          {minutesText(r.minutes)}
        </Text>
      </View>
      {warning ? (
        <Notice tone="danger" title="Ruled out here" testID={`${id}-warning`}>
          {warning}
        </Notice>
      ) : null}
      {r.reasons[0] ? <Text>{capitalise(r.reasons[0])}</Text> : null}
      {r.after ? (
        <View style={styles.after} testID={`${id}-after`}>
          <Text bold size="label">
            {afterLine(r.after)}
          </Text>
        </View>
      ) : null}
      {r.risks[0] ? (
        <Text tone="inkMuted" testID={`${id}-risk`}>
          Risk: {r.risks[0]}
        </Text>
      ) : null}
      {r.evidence ? (
        <View style={styles.evidence} testID={`${id}-evidence`}>
          <Text bold tone="good">
            {evidenceText(r.evidence)}
          </Text>
        </View>
      ) : null}
      {r.cautions.filter((c) => c !== warning).map((c) => (
        <Notice key={c} tone="caution" testID={`${id}-caution`}>
          {c}
        </Notice>
      ))}
      <Button
        label={open ? "Hide steps" : "Steps and sources"}
        variant="secondary"
        onPress={() => setOpen(!open)}
        hint={`${open ? "Hide" : "Show"} the steps for ${r.title.toLowerCase()}`}
        testID={`${id}-toggle`}
      />
      {open ? (
        <View style={styles.more} testID={`${id}-details`}>
          <Lines title="Steps, scaled to your funnel" lines={r.steps} numbered />
          <Lines title="Why it fits" lines={r.reasons.map(capitalise)} />
          <Lines title="What can go wrong" lines={r.risks.map(capitalise)} />
          <Lines
            title="Where your components go"
            lines={(r.componentMoves ?? []).map((m) => `${m.name}: ${m.from} → ${m.to} (${Math.round(m.fractionInOrganicAfter * 100)} % left in the organic)`)}
          />
          <Lines title="Your group's notes" lines={(r.groupNotes ?? []).map((n) => (n.evidence ? `${n.text} (${evidenceText(n.evidence).toLowerCase()})` : n.text))} />
          <Lines title={`Sources (${EVIDENCE_LEVEL[r.evidenceLevel]})`} lines={r.sources.map((s) => s.title)} />
        </View>
      ) : null}
    </Card>
  );
}

export function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

const styles = StyleSheet.create({
  head: { flexDirection: "row", alignItems: "center", gap: space.md, flexWrap: "wrap" },
  rank: {
    width: 32,
    height: 32,
    borderRadius: radii.pill,
    backgroundColor: colors.brand,
    alignItems: "center",
    justifyContent: "center",
  },
  grow: { flexGrow: 1, flexShrink: 1, flexBasis: 160 },
  after: { backgroundColor: colors.aqueousSoft, borderRadius: radii.sm, padding: space.sm },
  evidence: { backgroundColor: colors.goodSoft, borderRadius: radii.sm, padding: space.sm, alignSelf: "flex-start" },
  ruledOut: { borderColor: colors.danger, borderWidth: 2 },
  more: { gap: space.lg },
  block: { gap: space.xs },
  line: { flexDirection: "row", gap: space.sm },
  marker: { minWidth: 18 },
});
