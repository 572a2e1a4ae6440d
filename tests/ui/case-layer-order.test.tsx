import { render, screen } from "@testing-library/react-native";
import { LayerOrder, type OrderPrediction } from "../../components/cases/layer-order";

// Dichloromethane 1.3266 g/mL (CRC Handbook, 20 °C) over water 0.9982 g/mL (Kell 1975): organic sinks.
const dcmOverWater: OrderPrediction = { phases: 2, top: "aqueous", bottom: "organic", organicDensityGPerMl: 1.3266, aqueousDensityGPerMl: 0.9982 };

function funnelLabels(): string[] {
  return screen.queryAllByLabelText(/^Funnel drawing/).map((n) => n.props.accessibilityLabel as string);
}

describe("LayerOrder", () => {
  it("draws one funnel when the funnel agreed with the prediction", async () => {
    await render(<LayerOrder predicted={dcmOverWater} observedBottom="organic" organicMl={50} aqueousMl={40} testID="lo" />);
    expect(screen.getByTestId("lo-caption")).toHaveTextContent("Predicted and seen: organic at the bottom");
    const labels = funnelLabels();
    expect(labels).toHaveLength(1);
    expect(labels[0]).toContain("Top layer: aqueous, 40 mL, 0.998 g/mL. Bottom layer: organic, 50 mL, 1.327 g/mL");
  });

  it("draws both orders side by side when the layers came out the other way round", async () => {
    await render(<LayerOrder predicted={dcmOverWater} observedBottom="aqueous" organicMl={50} aqueousMl={40} testID="lo" />);
    expect(screen.getByTestId("lo-caption")).toHaveTextContent("The layers came out the other way round: aqueous at the bottom.");
    const labels = funnelLabels();
    expect(labels).toHaveLength(2);
    expect(labels[1]).toContain("Top layer: organic, 50 mL, 1.327 g/mL. Bottom layer: aqueous, 40 mL, 0.998 g/mL");
  });

  it("says the funnel was not checked when nothing was observed", async () => {
    await render(<LayerOrder predicted={dcmOverWater} observedBottom={null} organicMl={50} aqueousMl={40} testID="lo" />);
    expect(screen.getByTestId("lo-caption")).toHaveTextContent("Predicted: organic at the bottom · not checked at the funnel");
  });

  it("falls back to plain columns when the names had no densities", async () => {
    await render(<LayerOrder predicted={null} observedBottom="organic" organicMl={50} aqueousMl={40} testID="lo" />);
    expect(funnelLabels()).toHaveLength(0);
    expect(screen.getByTestId("lo").props.accessibilityLabel).toBe("Predicted: not known. Seen: aqueous on top, organic below");
  });
});
