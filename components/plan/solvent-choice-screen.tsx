import { useLocalSearchParams, useRouter } from "expo-router";
import { useMemo, useState } from "react";
import { StyleSheet, View } from "react-native";
import { greenerSubstitutes, rankSolvents, type RankedSolvent, type SolventConstraints } from "../../knowledge/plan";
import { findSolvent } from "../../knowledge/reference";
import type { GuideCategory } from "../../knowledge/types";
import { KnowledgeInputError } from "../../knowledge/types";
import { useLayout } from "../../hooks/breakpoints";
import { colors, radii, space } from "../../hooks/theme";
import { readDraft, writeDraft } from "../../hooks/use-draft";
import { useActiveGroup } from "../../hooks/use-me";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Chips } from "../ui/chips";
import { Field } from "../ui/field";
import { Notice } from "../ui/notice";
import { Screen } from "../ui/screen";
import { Text } from "../ui/text";
import { NEW_PLAN, readNumber, type PlanDraft } from "./plan-draft";
import { solventLabel } from "./plan-format";
import { newPlanDraftKey } from "./plan-screen";

type Layer = "any" | "top" | "bottom";
type Guide = "any" | GuideCategory;

interface Constraints {
  immiscible: boolean;
  layer: Layer;
  aqueous: "water" | "brine";
  bpMin: string;
  bpMax: string;
  noHalogen: boolean;
  noPeroxide: boolean;
  guide: Guide;
}

const START: Constraints = { immiscible: true, layer: "any", aqueous: "water", bpMin: "", bpMax: "", noHalogen: false, noPeroxide: false, guide: "any" };
const GUIDE_WORDS: Record<GuideCategory, string> = {
  recommended: "recommended",
  problematic: "problematic",
  hazardous: "hazardous",
  "highly-hazardous": "highly hazardous",
};
const FIRST_FAILING = 3;

function toKnowledge(c: Constraints): { constraints: SolventConstraints; problem?: string } {
  const bpMinC = c.bpMin.trim() ? readNumber(c.bpMin.replace(/\s*°?C$/i, "")) : undefined;
  const bpMaxC = c.bpMax.trim() ? readNumber(c.bpMax.replace(/\s*°?C$/i, "")) : undefined;
  const problem = (c.bpMin.trim() && bpMinC === undefined) || (c.bpMax.trim() && bpMaxC === undefined) ? "Boiling points are numbers in °C." : undefined;
  return {
    problem,
    constraints: {
      immiscibleWithWater: c.immiscible,
      ...(c.layer !== "any" ? { organicLayer: c.layer } : {}),
      aqueous: c.aqueous === "brine" ? { solute: "sodium-chloride", concentration: "saturated" } : { solute: "water" },
      ...(bpMinC !== undefined ? { bpMinC } : {}),
      ...(bpMaxC !== undefined ? { bpMaxC } : {}),
      noHalogen: c.noHalogen,
      noPeroxideFormer: c.noPeroxide,
      ...(c.guide !== "any" ? { minGuideCategory: c.guide } : {}),
    },
  };
}

/** /plan/solvent-choice: extraction solvents ranked under the constraints, and greener substitutes for one. */
export function SolventChoiceScreen() {
  const params = useLocalSearchParams<{ for?: string }>();
  const router = useRouter();
  const group = useActiveGroup();
  const wide = useLayout() === "wide";
  const [c, setC] = useState<Constraints>(START);
  const [chosen, setChosen] = useState<string | null>(() => (params.for ? (findSolvent(params.for)?.key ?? null) : null));
  const [showFailing, setShowFailing] = useState(false);
  const { constraints, problem } = toKnowledge(c);
  const ranked = useMemo(() => rankSolvents(constraints), [JSON.stringify(constraints)]);
  const meeting = ranked.filter((r) => r.meetsConstraints);
  const failing = ranked.filter((r) => !r.meetsConstraints);

  const takeIntoPlan = (key: string) => {
    if (!group) return;
    const k = newPlanDraftKey(group.userId);
    const current = readDraft<PlanDraft>(k)?.data ?? NEW_PLAN;
    writeDraft(k, { ...current, solvent: key });
    router.navigate("/plan" as never);
  };

  const form = (
    <Card testID="choice-constraints">
      <Text bold size="title" accessibilityRole="header">
        What the solvent must do
      </Text>
      <Chips label="Mix with water" showLabel options={[{ value: "no", label: "Must not mix" }, { value: "any", label: "Either" }]} selected={c.immiscible ? "no" : "any"} onSelect={(v) => setC({ ...c, immiscible: v === "no" })} testID="choice-immiscible" />
      <Chips
        label="Organic layer"
        showLabel
        options={[
          { value: "any", label: "Either" },
          { value: "top", label: "On top (lighter)" },
          { value: "bottom", label: "Below (denser)" },
        ]}
        selected={c.layer}
        onSelect={(layer) => setC({ ...c, layer })}
        testID="choice-layer"
      />
      <Chips label="Against" showLabel options={[{ value: "water", label: "Water" }, { value: "brine", label: "Saturated brine" }]} selected={c.aqueous} onSelect={(aqueous) => setC({ ...c, aqueous })} testID="choice-aqueous" />
      <View style={styles.row}>
        <View style={styles.half}>
          <Field label="Boils at least at (°C)" value={c.bpMin} onChangeText={(bpMin) => setC({ ...c, bpMin })} keyboardType="numbers-and-punctuation" testID="choice-bp-min" />
        </View>
        <View style={styles.half}>
          <Field label="Boils at most at (°C)" value={c.bpMax} onChangeText={(bpMax) => setC({ ...c, bpMax })} keyboardType="numbers-and-punctuation" testID="choice-bp-max" />
        </View>
      </View>
      {problem ? <Text tone="danger">{problem}</Text> : null}
      <Chips label="Halogen" showLabel options={[{ value: "no", label: "No halogen" }, { value: "any", label: "Allowed" }]} selected={c.noHalogen ? "no" : "any"} onSelect={(v) => setC({ ...c, noHalogen: v === "no" })} testID="choice-halogen" />
      <Chips label="Peroxide formers" showLabel options={[{ value: "no", label: "None" }, { value: "any", label: "Allowed" }]} selected={c.noPeroxide ? "no" : "any"} onSelect={(v) => setC({ ...c, noPeroxide: v === "no" })} testID="choice-peroxide" />
      <Chips
        label="Selection guide: at least"
        showLabel
        options={[{ value: "any", label: "Any" }, ...(["recommended", "problematic", "hazardous"] as const).map((g) => ({ value: g, label: GUIDE_WORDS[g] }))]}
        selected={c.guide}
        onSelect={(guide) => setC({ ...c, guide })}
        testID="choice-guide"
      />
    </Card>
  );

  const list = (
    <Card testID="choice-ranked">
      <Text bold size="title" accessibilityRole="header">
        {meeting.length} solvent{meeting.length === 1 ? "" : "s"} fit
      </Text>
      {meeting.length === 0 ? <Text tone="inkMuted">Nothing in the solvent table meets every constraint. Loosen one; the closest misses are below.</Text> : null}
      {meeting.map((r, i) => (
        <RankRow key={r.key} rank={i + 1} r={r} chosen={chosen === r.key} onChoose={() => setChosen(r.key)} />
      ))}
      {failing.length ? (
        <>
          <Text bold size="label">
            Miss a constraint
          </Text>
          {(showFailing ? failing : failing.slice(0, FIRST_FAILING)).map((r) => (
            <RankRow key={r.key} r={r} chosen={chosen === r.key} onChoose={() => setChosen(r.key)} />
          ))}
          {failing.length > FIRST_FAILING ? <Button label={showFailing ? "Show fewer" : `Show all ${failing.length}`} variant="quiet" onPress={() => setShowFailing(!showFailing)} testID="choice-show-failing" /> : null}
        </>
      ) : null}
      <Text size="caption" tone="inkMuted">
        Order: constraints met, then selection-guide category (CHEM21), then low mutual solubility with water, a clean split, and little water carried over.
      </Text>
    </Card>
  );

  const subs = chosen ? <Substitutes solventKey={chosen} onUse={takeIntoPlan} onClose={() => setChosen(null)} /> : null;
  return (
    <Screen title="Choose a solvent" subtitle="Ranked for extraction from water" width="full" actions={<Button label="Back to the plan" variant="secondary" onPress={() => router.navigate("/plan" as never)} testID="choice-back" />}>
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.left}>{form}</View>
          <View style={styles.right}>
            {subs}
            {list}
          </View>
        </View>
      ) : (
        <View style={styles.stack}>
          {form}
          {subs}
          {list}
        </View>
      )}
    </Screen>
  );
}

function RankRow({ r, rank, chosen, onChoose }: { r: RankedSolvent; rank?: number; chosen: boolean; onChoose: () => void }) {
  return (
    <View style={[styles.rankRow, chosen && styles.rankChosen]} testID={`choice-row-${r.key}`}>
      <View style={styles.rankHead}>
        <Text bold size="title" style={styles.shrink}>
          {rank ? `${rank}. ` : ""}
          {solventLabel(r.key)}
        </Text>
        <Text bold tone={r.guideCategory === "recommended" ? "good" : r.guideCategory === "problematic" ? "caution" : "danger"}>{GUIDE_WORDS[r.guideCategory]}</Text>
      </View>
      {r.failures.length ? (
        <Text tone="danger" size="caption">
          Misses: {r.failures.join("; ")}
        </Text>
      ) : null}
      <Text size="caption">{r.reasons.join(" · ")}</Text>
      <Button label={chosen ? "Showing substitutes" : "Greener substitutes"} variant="quiet" onPress={onChoose} disabled={chosen} testID={`choice-subs-${r.key}`} />
    </View>
  );
}

function Substitutes({ solventKey, onUse, onClose }: { solventKey: string; onUse: (key: string) => void; onClose: () => void }) {
  const advice = useMemo(() => {
    try {
      return { ok: true as const, value: greenerSubstitutes(solventKey) };
    } catch (e) {
      if (e instanceof KnowledgeInputError) return { ok: false as const, message: e.message };
      throw e;
    }
  }, [solventKey]);
  return (
    <Card testID="choice-substitutes">
      <View style={styles.rankHead}>
        <Text bold size="title" accessibilityRole="header" style={styles.shrink}>
          Instead of {solventLabel(solventKey)}
        </Text>
        <Button label="Close" variant="quiet" onPress={onClose} testID="choice-subs-close" />
      </View>
      <Button label={`Use ${solventLabel(solventKey)} in my plan`} variant="secondary" onPress={() => onUse(solventKey)} testID={`choice-use-${solventKey}`} />
      {!advice.ok ? (
        <Notice tone="info">{advice.message}</Notice>
      ) : (
        <>
          {advice.value.note ? <Text tone="inkMuted">{advice.value.note}</Text> : null}
          {advice.value.substitutes.map((s) => (
            <View key={s.key} style={styles.rankRow} testID={`choice-sub-${s.key}`}>
              <View style={styles.rankHead}>
                <Text bold style={styles.shrink}>
                  {solventLabel(s.key)}
                </Text>
                <Text bold tone={s.guideCategory === "recommended" ? "good" : s.guideCategory === "problematic" ? "caution" : "danger"}>{GUIDE_WORDS[s.guideCategory]}</Text>
              </View>
              {s.caveats.map((cv) => (
                <Text key={cv} size="caption">
                  • {cv}
                </Text>
              ))}
              <Button label={`Use ${s.name} in my plan`} variant="quiet" onPress={() => onUse(s.key)} testID={`choice-use-${s.key}`} />
            </View>
          ))}
          <Text bold size="label">
            Before switching, check
          </Text>
          {advice.value.checklist.map((item) => (
            <Text key={item} size="caption">
              • {item}
            </Text>
          ))}
          <Text size="caption" tone="inkMuted">
            Replacement table after Alfonsi et al. 2008 and the CHEM21 guide (recalled); confirm against your site's solvent guide.
          </Text>
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  columns: { flexDirection: "row", alignItems: "flex-start", gap: space.lg },
  left: { flex: 1, maxWidth: 460 },
  right: { flex: 1.4, gap: space.lg },
  row: { flexDirection: "row", flexWrap: "wrap", gap: space.sm },
  half: { flexGrow: 1, flexBasis: 140 },
  rankRow: { gap: space.xs, padding: space.md, borderRadius: radii.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.paper },
  rankChosen: { borderColor: colors.brand, borderWidth: 2 },
  rankHead: { flexDirection: "row", justifyContent: "space-between", alignItems: "baseline", flexWrap: "wrap", gap: space.sm },
  shrink: { flexShrink: 1 },
});
