import { StyleSheet, View } from "react-native";
import { space } from "../../hooks/theme";
import type { CasePhase } from "../../knowledge/contracts/cases";
import { FunnelDrawing, type DrawnLayer } from "../layers/funnel-drawing";
import { Text } from "../ui/text";
import { PhaseBands } from "./phase-bands";

export interface OrderPrediction {
  phases: 1 | 2;
  top: CasePhase | null;
  bottom: CasePhase | null;
  organicDensityGPerMl: number;
  aqueousDensityGPerMl: number;
}

const other = (p: CasePhase): CasePhase => (p === "organic" ? "aqueous" : "organic");
const LABEL: Record<CasePhase, string> = { organic: "Organic", aqueous: "Aqueous" };

function layers(order: [CasePhase, CasePhase], p: OrderPrediction, volumes: Record<CasePhase, number>): DrawnLayer[] {
  const density: Record<CasePhase, number> = { organic: p.organicDensityGPerMl, aqueous: p.aqueousDensityGPerMl };
  return order.map((phase) => ({ phase, label: LABEL[phase], volumeMl: volumes[phase], densityGPerMl: density[phase] }));
}

/**
 * Predicted against seen layer order. With a prediction, the layer check's funnel drawing: one
 * funnel when the funnel agreed (or was not checked), two side by side when it did not. Without
 * one (a name not in the tables), two plain columns of what was seen.
 */
export function LayerOrder({
  predicted,
  observedBottom,
  organicMl,
  aqueousMl,
  testID,
}: {
  predicted: OrderPrediction | null;
  observedBottom: CasePhase | null;
  organicMl: number;
  aqueousMl: number;
  testID?: string;
}) {
  const volumes = { organic: organicMl, aqueous: aqueousMl };
  if (!predicted || !predicted.bottom || !predicted.top) {
    if (predicted?.phases === 1) {
      return (
        <View style={styles.one} testID={testID}>
          <FunnelDrawing layers={[{ phase: "mixed", label: "One phase", volumeMl: organicMl + aqueousMl, densityGPerMl: null }]} />
          <Text bold>
            Predicted: one phase{observedBottom ? ` · seen: two layers, ${observedBottom} at the bottom` : ""}
          </Text>
        </View>
      );
    }
    return (
      <PhaseBands
        testID={testID}
        columns={[
          { label: "Predicted", order: null },
          { label: "Seen", order: observedBottom ? [other(observedBottom), observedBottom] : null, organicMl, aqueousMl },
        ]}
      />
    );
  }
  const predictedOrder: [CasePhase, CasePhase] = [predicted.top, predicted.bottom];
  if (!observedBottom || observedBottom === predicted.bottom) {
    return (
      <View style={styles.one} testID={testID}>
        <FunnelDrawing layers={layers(predictedOrder, predicted, volumes)} />
        <Text bold testID={testID ? `${testID}-caption` : undefined}>
          {observedBottom ? `Predicted and seen: ${predicted.bottom} at the bottom` : `Predicted: ${predicted.bottom} at the bottom · not checked at the funnel`}
        </Text>
      </View>
    );
  }
  return (
    <View style={styles.two} testID={testID}>
      <View style={styles.one}>
        <Text bold>Predicted</Text>
        <FunnelDrawing layers={layers(predictedOrder, predicted, volumes)} />
      </View>
      <View style={styles.one}>
        <Text bold>Seen at the funnel</Text>
        <FunnelDrawing layers={layers([other(observedBottom), observedBottom], predicted, volumes)} />
      </View>
      <Text bold tone="caution" testID={testID ? `${testID}-caption` : undefined}>
        The layers came out the other way round: {observedBottom} at the bottom.
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  one: { gap: space.xs },
  two: { flexDirection: "row", flexWrap: "wrap", gap: space.lg },
});
