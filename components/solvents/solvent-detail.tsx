import { StyleSheet, View } from "react-native";
import type { ResolvedValue, SolventDetail } from "../../knowledge/contracts/solvents";
import { ApiError } from "../../hooks/api";
import { colors, radii, space, toneColors } from "../../hooks/theme";
import { useSolventQuery } from "../../hooks/use-solvents";
import { Card } from "../ui/card";
import { formatDensity, trimNumber } from "../ui/format";
import { Empty, ErrorState, Loading } from "../ui/states";
import { Text } from "../ui/text";
import { GUIDE_LABEL, GUIDE_TONE, MISCIBILITY_LABEL, peroxideLabel } from "./solvent-words";

const pct = (v: number | null, none: string) => (v === null ? none : `${trimNumber(v, 2)} % w/w`);
const celsius = (v: number) => `${trimNumber(v, 1)} °C`;

/** One curated value: what it is, the value, any note, and where it comes from. */
function ValueRow<T>({ label, value, show }: { label: string; value: ResolvedValue<T>; show: (v: T) => string }) {
  return (
    <View style={styles.valueRow} accessible accessibilityLabel={`${label}: ${show(value.value)}. Source: ${value.sourceTitle}`}>
      <View style={styles.valueHead}>
        <Text bold style={styles.valueLabel}>
          {label}
        </Text>
        <Text size="title">{show(value.value)}</Text>
      </View>
      {value.note ? (
        <Text size="caption" tone="inkMuted">
          {value.note}
        </Text>
      ) : null}
      <Text size="caption" tone="info">
        {`Source: ${value.sourceTitle}`}
      </Text>
    </View>
  );
}

function Values({ s }: { s: SolventDetail }) {
  const miscible = s.miscibility.value === "miscible";
  return (
    <>
      <Card>
        <Text bold size="title">
          Density and phase behaviour
        </Text>
        <ValueRow label="Density at 20 °C" value={s.densityGPerMl20C} show={formatDensity} />
        <ValueRow label="Change with temperature" value={s.densityTempCoeffGPerMlPerK} show={(v) => `${trimNumber(v, 6)} g/mL per °C`} />
        <ValueRow label="Miscibility with water" value={s.miscibility} show={(v) => MISCIBILITY_LABEL[v]} />
        <ValueRow label="Dissolves in water" value={s.solubilityInWaterWtPct} show={(v) => pct(v, miscible ? "mixes in all proportions" : "—")} />
        <ValueRow label="Water it takes up" value={s.waterInSolventWtPct} show={(v) => pct(v, miscible ? "mixes in all proportions" : "—")} />
      </Card>
      <Card>
        <Text bold size="title">
          Physical constants
        </Text>
        <ValueRow label="Molar mass" value={s.molarMassGPerMol} show={(v) => `${trimNumber(v, 2)} g/mol`} />
        <ValueRow label="Boiling point" value={s.boilingPointC} show={celsius} />
        <ValueRow label="Melting point" value={s.meltingPointC} show={celsius} />
        {s.antoine ? (
          <ValueRow
            label="Antoine constants"
            value={s.antoine}
            show={(a) =>
              `A ${a.a}, B ${a.b}, C ${a.c} (log10 P/${a.pressureUnit} = A − B/(C + T/°${a.temperatureUnit === "C" ? "C" : "K"})), ${trimNumber(a.minC, 0)} to ${trimNumber(a.maxC, 0)} °C`
            }
          />
        ) : null}
      </Card>
      <Card>
        <Text bold size="title">
          Safety
        </Text>
        <ValueRow label="Flash point (closed cup)" value={s.flashPointC} show={(v) => (v === null ? "none" : celsius(v))} />
        <ValueRow label="Peroxide former" value={s.peroxideClass} show={peroxideLabel} />
        <Text>{s.halogenated ? "Halogenated: collect as halogenated waste." : "Not halogenated."}</Text>
        <Text size="caption" tone="inkMuted">
          Reference values only: the SDS of your bottle and your local rules decide how to handle it.
        </Text>
      </Card>
    </>
  );
}

/** Every value of one solvent with its source, and its CHEM21 category with the reason. Read-only. */
export function SolventDetailView({ solventKey }: { solventKey: string }) {
  const q = useSolventQuery(solventKey);
  if (q.isPending) return <Loading label="Loading the solvent…" />;
  if (q.isError) {
    if (q.error instanceof ApiError && q.error.status === 404) {
      return <Empty title="Not in the tables" body={`No solvent has the key or CAS number “${solventKey}”. Search the list instead.`} />;
    }
    return <ErrorState error={q.error} onRetry={() => q.refetch()} />;
  }
  const s = q.data;
  const g = s.guide.value;
  const t = toneColors[GUIDE_TONE[g.category]];
  return (
    <View style={styles.stack} testID="solvent-detail">
      <View style={styles.head}>
        <Text size="headline" accessibilityRole="header">
          {s.name}
        </Text>
        <Text tone="inkMuted">{`${s.formula} · CAS ${s.cas}`}</Text>
        {s.synonyms.length ? <Text tone="inkMuted">{`Also: ${s.synonyms.join(", ")}`}</Text> : null}
      </View>
      <View style={[styles.guide, { backgroundColor: colors[t.bg], borderColor: colors[t.fg] }]} testID="solvent-guide">
        <Text bold tone={t.fg}>
          {`CHEM21 category: ${GUIDE_LABEL[g.category]}`}
        </Text>
        <Text>{`Why: ${g.reason}`}</Text>
        <Text size="caption" tone="info">
          {`Source: ${s.guide.sourceTitle}`}
        </Text>
      </View>
      <Values s={s} />
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  head: { gap: space.xs },
  guide: { borderLeftWidth: 5, borderWidth: 1, borderRadius: radii.sm, padding: space.md, gap: space.xs },
  valueRow: { gap: 2, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  valueHead: { flexDirection: "row", flexWrap: "wrap", justifyContent: "space-between", alignItems: "baseline", gap: space.sm },
  valueLabel: { flexShrink: 1 },
});
