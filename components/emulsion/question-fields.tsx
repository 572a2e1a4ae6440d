import { useState } from "react";
import { StyleSheet, View } from "react-native";
import { REAGENT_TAGS, type ReagentTag } from "../../knowledge/emulsion";
import { space } from "../../hooks/theme";
import { ChoiceChips, ToggleChips } from "../cases/choice-chips";
import { Button } from "../ui/button";
import { Card } from "../ui/card";
import { Field } from "../ui/field";
import { formatVolumeMl } from "../ui/format";
import { Text } from "../ui/text";
import {
  CO_SOLVENTS,
  EMULSIFIED_PCT,
  FUNNEL_ML,
  MINUTES_WAITED,
  REAGENT_LABELS,
  SEEN_FLAGS,
  SEEN_LABELS,
  SHAKING,
  type EmulsionAnswers,
  type ProductKind,
  type SeenFlag,
  type Shaking,
} from "./answers";

/** Reagent chips shown before "More reagents": the usual emulsifiers and solid-formers. */
const FIRST_REAGENTS: string[] = ["fatty-acid", "greasy-amine", "phase-transfer-catalyst", "surfactant", "aluminium", "metal-salts", "carbonate"];
const SHAKING_LABELS: Record<Shaking, string> = { gentle: "Gently", normal: "Normally", vigorous: "Hard" };
const PRODUCT_KINDS: { value: ProductKind; label: string }[] = [
  { value: "acid", label: "An acid" },
  { value: "base", label: "A base" },
  { value: "neutral", label: "Neutral" },
];

/** Numbers as chip values: ChoiceChips holds strings. */
function numberChips<N extends number>(values: readonly N[], label: (n: N) => string) {
  return values.map((n) => ({ value: String(n), label: label(n) }));
}
const toNumber = (v: string | null) => (v === null ? null : Number(v));

interface Props {
  answers: EmulsionAnswers;
  onChange: (next: EmulsionAnswers) => void;
  errors: Record<string, string>;
}

/** What the chemist sees, then what they know. Every question can stay unanswered. */
export function SeenFields({ answers: a, onChange }: Props) {
  return (
    <Card testID="emulsion-seen">
      <Text bold size="title" accessibilityRole="header">
        What you see
      </Text>
      <ChoiceChips
        label="How much of the liquid is emulsified?"
        choices={numberChips(EMULSIFIED_PCT, (n) => (n === 100 ? "All of it" : `${n} %`))}
        value={a.emulsifiedPct === null ? null : String(a.emulsifiedPct)}
        onChange={(v) => onChange({ ...a, emulsifiedPct: toNumber(v) })}
        testID="emulsion-fraction"
      />
      <ToggleChips<SeenFlag>
        label="Tap all that apply"
        choices={SEEN_FLAGS.map((f) => ({ value: f, label: SEEN_LABELS[f] }))}
        values={a.seen}
        onChange={(seen) => onChange({ ...a, seen })}
        testID="emulsion-seen-flag"
      />
    </Card>
  );
}

export function KnownFields({ answers: a, onChange, errors }: Props) {
  const [allReagents, setAllReagents] = useState(() => a.reagents.some((r) => !FIRST_REAGENTS.includes(r)));
  const rest = REAGENT_TAGS.filter((t) => !FIRST_REAGENTS.includes(t));
  const reagentChoices = [...FIRST_REAGENTS, ...(allReagents ? rest : [])].map((t) => ({ value: t, label: REAGENT_LABELS[t as ReagentTag] ?? t }));
  const product = a.product;
  const setProduct = (patch: Partial<EmulsionAnswers["product"]>) => onChange({ ...a, product: { ...product, ...patch } });
  return (
    <Card testID="emulsion-known">
      <Text bold size="title" accessibilityRole="header">
        What you know
      </Text>
      <Text tone="inkMuted">Skip anything you are not sure of.</Text>
      <ToggleChips
        label="In the mixture"
        choices={reagentChoices}
        values={a.reagents}
        onChange={(reagents) => onChange({ ...a, reagents })}
        testID="emulsion-reagent"
      />
      {!allReagents ? <Button label="More reagents" variant="quiet" onPress={() => setAllReagents(true)} testID="emulsion-more-reagents" /> : null}
      <ToggleChips
        label="Water-miscible solvent still in"
        choices={CO_SOLVENTS.map((s) => ({ value: s as string, label: s }))}
        values={a.coSolvents}
        onChange={(coSolvents) => onChange({ ...a, coSolvents })}
        testID="emulsion-cosolvent"
      />
      <Field
        label="Aqueous pH, if measured"
        value={a.phText}
        onChangeText={(phText) => onChange({ ...a, phText })}
        keyboardType="numeric"
        placeholder="e.g. 13.5"
        error={errors["known.ph"]}
        help="Leave empty and the wash's pH is worked out from what it is."
        testID="emulsion-ph"
      />
      <ChoiceChips<Shaking>
        label="How hard was it shaken?"
        choices={SHAKING.map((s) => ({ value: s, label: SHAKING_LABELS[s] }))}
        value={a.shaking}
        onChange={(shaking) => onChange({ ...a, shaking })}
        testID="emulsion-shaking"
      />
      <ChoiceChips
        label="Minutes already waited"
        choices={numberChips(MINUTES_WAITED, (n) => (n === 0 ? "None" : n >= 60 ? "An hour or more" : `${n} min`))}
        value={a.minutesWaited === null ? null : String(a.minutesWaited)}
        onChange={(v) => onChange({ ...a, minutesWaited: toNumber(v) })}
        testID="emulsion-waited"
      />
      <ChoiceChips
        label="Funnel size"
        choices={numberChips(FUNNEL_ML, (n) => formatVolumeMl(n))}
        value={a.funnelMl === null ? null : String(a.funnelMl)}
        onChange={(v) => onChange({ ...a, funnelMl: toNumber(v) })}
        testID="emulsion-funnel-size"
      />
      <ChoiceChips<ProductKind>
        label="Your product is…"
        choices={PRODUCT_KINDS}
        value={product.kind}
        onChange={(kind) => setProduct({ kind })}
        testID="emulsion-product-kind"
      />
      {product.kind ? (
        <View style={styles.product}>
          <Field label="Name (optional)" value={product.name} onChangeText={(name) => setProduct({ name })} testID="emulsion-product-name" />
          {product.kind !== "neutral" ? (
            <Field
              label={product.kind === "base" ? "pKa of its conjugate acid" : "pKa"}
              value={product.pKaText}
              onChangeText={(pKaText) => setProduct({ pKaText })}
              keyboardType="numeric"
              error={errors["components[0].pKa"]}
              testID="emulsion-product-pka"
            />
          ) : null}
          <Field
            label="log P"
            value={product.logPText}
            onChangeText={(logPText) => setProduct({ logPText })}
            keyboardType="numeric"
            error={errors["components[0].logP"]}
            help="The pH remedy then checks that your product stays in the organic layer."
            testID="emulsion-product-logp"
          />
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  product: { gap: space.md },
});
