import { useMemo } from "react";
import { View } from "react-native";
import { parseConcentration, parseTemperatureC, parseVolumeMl } from "../../knowledge/concentration";
import { predictLayers, type LayerPrediction } from "../../knowledge/layers";
import { Text } from "../ui/text";
import type { CaseDraftValue } from "./case-draft";
import { LayerOrder } from "./layer-order";

function tryOr<T>(fn: () => T): T | undefined {
  try {
    return fn();
  } catch {
    return undefined;
  }
}

/** The layer check's answer for what is typed so far, or null while it cannot answer. */
export function predictFromDraft(d: CaseDraftValue): LayerPrediction | null {
  const organic = d.organic.map((o) => ({ solvent: o.solvent, volumeMl: tryOr(() => parseVolumeMl(o.volume)) ?? NaN }));
  const volumeMl = tryOr(() => parseVolumeMl(d.aqueous.volume));
  if (!organic.length || organic.some((o) => !o.solvent.trim() || !(o.volumeMl > 0)) || !d.aqueous.solute.trim() || !volumeMl) return null;
  const concentration = d.aqueous.concentration.trim() ? tryOr(() => parseConcentration(d.aqueous.concentration)) : undefined;
  const temperatureC = tryOr(() => parseTemperatureC(d.temperature || "20")) ?? 20;
  return tryOr(() => predictLayers({ organic, aqueous: { solute: d.aqueous.solute, volumeMl, ...(concentration ? { concentration } : {}) }, temperatureC })) ?? null;
}

/** Live layer check inside the form: the prediction beside what the chemist says they see. */
export function LayerPreview({ draft }: { draft: CaseDraftValue }) {
  const p = useMemo(() => predictFromDraft(draft), [draft]);
  return (
    <View testID="layer-preview">
      {p ? (
        <Text size="label" bold>
          {p.phases === 1
            ? "Predicted: one phase (the organic mixes with the water)"
            : `Predicted: ${p.bottom} at the bottom · ${p.organicDensityGPerMl.toFixed(3)} vs ${p.aqueousDensityGPerMl.toFixed(3)} g/mL${p.confidence === "clear" ? "" : p.confidence === "close" ? " (close: confirm with a drop of water)" : " (too close to call)"}`}
        </Text>
      ) : (
        <Text size="caption" tone="inkMuted">
          The predicted layers appear once the solvents, the aqueous phase and their volumes are in.
        </Text>
      )}
      {p ? (
        <LayerOrder predicted={p} observedBottom={draft.observedBottom} organicMl={p.organicVolumeMl} aqueousMl={p.aqueousVolumeMl} testID="form-layers" />
      ) : null}
    </View>
  );
}
