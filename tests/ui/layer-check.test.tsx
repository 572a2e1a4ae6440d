import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, within } from "@testing-library/react-native";
import { LayerCheck } from "../../components/layers/layer-check-screen";

const mockRouter = { setParams: jest.fn(), push: jest.fn(), replace: jest.fn() };
jest.mock("expo-router", () => ({
  useRouter: () => mockRouter,
  useLocalSearchParams: () => ({}),
}));

/*
 * The layer check computes in the browser: no request may leave it. Expected densities at 20 °C:
 * dichloromethane 1.327 g/mL (CRC Handbook, 1.3266), 50 % w/w NaOH 1.525 g/mL (Perry's, 1.5253),
 * toluene 0.867 g/mL (CRC, 0.8669), water 0.998 g/mL (Kell 1975).
 */

let owner = 0;
async function renderCheck(who = `tester-${++owner}`) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const view = await render(
    <QueryClientProvider client={client}>
      <LayerCheck owner={who} />
    </QueryClientProvider>,
  );
  return { who, view };
}

async function pick(picker: string, typed: string, key: string) {
  await fireEvent.changeText(screen.getByTestId(`${picker}-search`), typed);
  await fireEvent.press(screen.getByTestId(`${picker}-option-${key}`));
}

const textOf = (id: string) => {
  const node = screen.getByTestId(id);
  return within(node)
    .queryAllByText(/.*/)
    .map((n) => String(n.props.children))
    .join(" ");
};

describe("LayerCheck", () => {
  const realFetch = global.fetch;
  let fetchSpy: jest.Mock;
  beforeEach(() => {
    fetchSpy = jest.fn(() => Promise.reject(new Error("offline")));
    global.fetch = fetchSpy as unknown as typeof fetch;
  });
  afterEach(() => {
    global.fetch = realFetch;
  });

  it("puts DCM on top of 50 % NaOH, warns of the inversion and draws it, without a network call", async () => {
    await renderCheck();
    expect(screen.getByTestId("answer-waiting")).toHaveTextContent(/Choose the organic solvent and the aqueous phase/);
    await pick("organic-0", "DCM", "dichloromethane");
    await pick("aqueous", "NaOH", "sodium-hydroxide");
    await fireEvent.changeText(screen.getByTestId("aqueous-concentration"), "50 %");

    expect(screen.getByTestId("answer-top")).toHaveTextContent("Top layer: organic");
    expect(screen.getByTestId("answer-bottom")).toHaveTextContent("Bottom layer: aqueous");
    expect(screen.getByTestId("warning-inverted-order")).toHaveTextContent(/Unlike over plain water, the organic layer is predicted on the top/);
    const answer = textOf("layer-answer");
    expect(answer).toContain("dichloromethane, 1.327 g/mL");
    expect(answer).toContain("50 % w/w sodium hydroxide, 1.525 g/mL");
    expect(answer).toContain("Margin 0.199 g/mL"); // 1.5253 − 1.3266 = 0.1987
    expect(screen.getByTestId("funnel-drawing").props.accessibilityLabel).toBe(
      "Funnel drawing. Top layer: organic, 50 mL, 1.327 g/mL. Bottom layer: aqueous, 50 mL, 1.525 g/mL. Layer heights are drawn in proportion to volume.",
    );
    expect(screen.getByTestId("cautions")).toHaveTextContent(/Halogenated solvent/);
    // Computed on the device with the network down: the only requests are for the group's corrections.
    const urls = fetchSpy.mock.calls.map((c) => String((c as unknown[])[0]));
    expect(urls.filter((u) => !/\/api\/(me|reference\/overrides)/.test(u))).toEqual([]);
  });

  it("takes water without a concentration and reads volumes typed with units", async () => {
    await renderCheck();
    await pick("organic-0", "PhMe", "toluene");
    await pick("aqueous", "water", "water");
    expect(screen.queryByTestId("aqueous-concentration")).toBeNull();
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "0.1 L");
    expect(screen.getByText("Read as 100 mL")).toBeTruthy();
    expect(screen.getByTestId("answer-top")).toHaveTextContent("Top layer: organic");
    expect(screen.getByTestId("funnel-drawing").props.accessibilityLabel).toMatch(/Top layer: organic, 100 mL, 0\.867 g\/mL\. Bottom layer: aqueous, 50 mL, 0\.998 g\/mL/);
    expect(screen.getByTestId("answer-certainty")).toHaveTextContent(/Clear call/);
    expect(screen.queryByTestId("answer-rests-on")).toBeNull();
  });

  it("mixes a co-solvent by volume and says it assumed ideal mixing", async () => {
    await renderCheck();
    await pick("organic-0", "CH2Cl2", "dichloromethane");
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "30 mL");
    await fireEvent.press(screen.getByTestId("organic-add"));
    await pick("organic-1", "hexane", "hexane");
    await pick("aqueous", "water", "water");
    // By hand from CRC densities: (30 × 1.3266 + 10 × 0.6594) / 40 = 1.1598 g/mL.
    expect(textOf("layer-answer")).toContain("dichloromethane + hexane, 1.160 g/mL");
    expect(screen.getByTestId("answer-bottom")).toHaveTextContent("Bottom layer: organic");
    expect(screen.getByTestId("answer-rests-on")).toHaveTextContent("Ideal mixing of the solvents assumed.");
  });

  it("reads sat. brine as saturated and refuses brine above saturation at the field", async () => {
    await renderCheck();
    await pick("organic-0", "EtOAc", "ethyl-acetate");
    await fireEvent.changeText(screen.getByTestId("aqueous-search"), "sat. brine");
    await fireEvent.press(screen.getByTestId("aqueous-option-sodium-chloride"));
    expect(screen.getByTestId("aqueous-concentration").props.value).toBe("saturated");
    // CRC: saturated NaCl (26.4 % w/w) is about 1.20 g/mL at 20 °C.
    expect(textOf("layer-answer")).toMatch(/saturated sodium chloride \(26\.4 % w\/w\), 1\.20\d g\/mL/);

    await fireEvent.changeText(screen.getByTestId("aqueous-concentration"), "30 %");
    // Once under the field and once in place of the answer.
    expect(screen.getAllByText(/saturates at about 26\.4 % w\/w at 20 °C; 30 % w\/w is above saturation/)).toHaveLength(2);
    expect(screen.getByTestId("answer-waiting")).toHaveTextContent(/^Not yet: /);
    expect(screen.getByTestId("aqueous-concentration").props["aria-invalid"]).toBe(true);
  });

  it("keeps the inputs when the screen goes away and comes back (a phone that locked)", async () => {
    const { who, view } = await renderCheck();
    await pick("organic-0", "chloroform", "chloroform");
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "35 mL");
    await view.unmount();
    await renderCheck(who);
    expect(screen.getByTestId("organic-0-chosen")).toHaveTextContent(/Chloroform/);
    expect(screen.getByTestId("organic-0-volume").props.value).toBe("35 mL");
  });
});
