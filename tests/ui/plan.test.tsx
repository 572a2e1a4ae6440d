import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor } from "@testing-library/react-native";
import { PlanScreen } from "../../components/plan/plan-screen";
import { SavedPlanScreen } from "../../components/plan/saved-plan-screen";
import { draftFromDocument, evaluatePlan, examplePlan } from "../../components/plan/plan-draft";
import { formatPh, formatShare } from "../../components/plan/plan-format";
import { removeDraft } from "../../hooks/use-draft";

const mockPush = jest.fn();
const mockNavigate = jest.fn();
let mockParams: Record<string, string> = {};
jest.mock("expo-router", () => ({
  useRouter: () => ({ push: mockPush, navigate: mockNavigate, replace: jest.fn() }),
  useLocalSearchParams: () => mockParams,
  Link: ({ children }: { children: React.ReactNode }) => children,
}));

/*
 * Hand-worked numbers for the worked example (80 mL ethyl acetate; benzylamine pKa 9.34, K 12,
 * 3 mmol; aryl acid pKa 4.2, K 60, 1.5 mmol; amide log P 2.1; 2 × 25 mL 1 M HCl, 2 × 25 mL sat.
 * NaHCO3, 25 mL brine):
 *  - pass 1 of HCl: 25 mmol H⁺ − 3 mmol taken by the amine → [H⁺] = 22/25 M, pH = 0.056 → "0.1".
 *  - the amide (K = 10^2.1 = 125.9) keeps (125.9·80 / (125.9·80 + 25))⁵ = 98.8 % over five passes
 *    (multiple-extraction formula, Nichols ch. 4).
 *  - funnel: 80 + 25 = 105 mL > ¾ × 125 mL, ≤ ¾ × 250 mL → 250 mL (common practice).
 */

type Call = { url: string; method: string; body: unknown };
const ME = {
  user: { id: "u-kit", email: "kit@larchmere.example", name: "Kit Ambrose" },
  groups: [{ id: "g1", name: "Larchmere Process Group", slug: "larchmere", role: "chemist" }],
  activeGroupId: "g1",
};

function fakeFetch(routes: Record<string, (call: Call) => { status: number; body?: unknown }>, calls: Call[]) {
  return jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input instanceof Request ? input.url : input);
    const call = { url, method: init?.method ?? "GET", body: init?.body ? JSON.parse(String(init.body)) : undefined };
    calls.push(call);
    const key = `${call.method} ${new URL(url).pathname}`;
    const handler = routes[key];
    const res = handler ? handler(call) : { status: 404, body: { error: { code: "not_found", message: key } } };
    return new Response(res.body === undefined ? null : JSON.stringify(res.body), { status: res.status, headers: { "content-type": "application/json" } });
  });
}

async function renderWith(ui: React.ReactElement) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  await render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>);
}

const realFetch = global.fetch;
afterEach(() => {
  global.fetch = realFetch;
  removeDraft("plan.new.u-kit");
  mockPush.mockReset();
  mockNavigate.mockReset();
  mockParams = {};
});

describe("number formats (UX.md)", () => {
  it.each([
    [-1.7e-7, "0.0"],
    [0.0969, "0.1"],
    [8.34, "8.3"],
    [-0.26, "-0.3"],
  ])("pH %s shows as %s", (pH, shown) => expect(formatPh(pH)).toBe(shown));

  it.each([
    [0, "0 %"],
    [4e-8, "< 0.1 %"],
    [0.0012, "0.1 %"],
    [0.05, "5.0 %"],
    [0.98812, "98.8 %"],
    [0.99999996, "> 99.9 %"],
    [1, "> 99.9 %"],
  ])("share %s shows as %s", (f, shown) => expect(formatShare(f)).toBe(shown));
});

describe("plan draft", () => {
  it("goes to the API's document and back without change", () => {
    const first = evaluatePlan(examplePlan());
    if (first.status !== "ok") throw new Error("example must compute");
    const again = evaluatePlan(draftFromDocument(first.doc));
    if (again.status !== "ok") throw new Error("round trip must compute");
    expect(again.doc).toEqual(first.doc);
  });

  it("reads a hand-written document's names into the pickers' keys", () => {
    const d = draftFromDocument({
      organic: { solvent: "EtOAc", volumeMl: 50 },
      components: [],
      washes: [{ aqueous: { solute: "HCl", concentration: { value: 1, unit: "mol/L" } }, volumeMl: 20, repeats: 2 }],
      temperatureC: 20,
    });
    expect(d.solvent).toBe("ethyl-acetate");
    expect(d.washes[0]).toMatchObject({ solute: "hydrochloric-acid", concentration: "1 M", volume: "20 mL", repeats: "2" });
  });
});

describe("PlanScreen", () => {
  const routes = (created: unknown) => ({
    "GET /api/me": () => ({ status: 200, body: ME }),
    "GET /api/plans": () => ({ status: 200, body: { plans: [] } }),
    "POST /api/plans": () => ({ status: 201, body: created }),
  });

  it("computes the worked example live: pH, layer order, shares and funnel as worked by hand", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(routes({}), calls) as typeof fetch;
    await renderWith(<PlanScreen />);
    await fireEvent.press(await screen.findByTestId("plan-load-example"));
    await screen.findByTestId("plan-results");
    expect(screen.getByText(/Plans you save appear here/)).toBeTruthy();

    const pH1 = -Math.log10(22 / 25);
    expect(formatPh(pH1)).toBe("0.1");
    const first = screen.getByTestId("plan-step-0.1");
    expect(first).toHaveTextContent(new RegExp(`pH ${formatPh(pH1).replace(".", "\\.")}`));
    expect(first).toHaveTextContent(/organic on top/);
    for (const key of ["0.1", "0.2", "1.1", "1.2", "2.1"]) expect(screen.getByTestId(`plan-step-${key}`)).toBeTruthy();

    const K = 10 ** 2.1;
    const kept = ((K * 80) / (K * 80 + 25)) ** 5;
    expect(screen.getByTestId("plan-fate-2")).toHaveTextContent(new RegExp(`${formatShare(kept).replace(".", "\\.")} stays`));
    expect(screen.getByTestId("plan-bar-2").props.accessibilityLabel).toMatch(new RegExp(`^amide product: ${formatShare(kept).replace(".", "\\.")} stays in the organic layer`));
    expect(screen.getByTestId("plan-funnel-size")).toHaveTextContent(/^250 mL$/);
    // the pictures say what they show
    expect(screen.getByTestId("plan-ph-chart").props.accessibilityLabel).toMatch(/Washes marked at pH 0\.0 \(wash 1\), pH 8\.3 \(wash 2\), pH 7\.0 \(wash 3\)/);
    expect(screen.getByTestId("plan-passes-curve").props.accessibilityLabel).toMatch(/^Share of benzylamine \(excess\) left/);
    // the recovery of the acid from its bicarbonate extract warns of the gas
    expect(screen.getByTestId("plan-recovery-co2")).toHaveTextContent(/vent a stoppered funnel after every inversion/);
    // no network call computes the plan
    expect(calls.filter((c) => c.url.includes("/compute"))).toHaveLength(0);
  });

  it("keeps what was typed and says what is wrong with it", async () => {
    global.fetch = fakeFetch(routes({}), []) as typeof fetch;
    await renderWith(<PlanScreen />);
    await fireEvent.press(await screen.findByTestId("plan-load-example"));
    await fireEvent.changeText(screen.getByTestId("plan-wash-0-volume"), "lots");
    expect(screen.getByTestId("plan-wash-0-volume").props.value).toBe("lots");
    expect(await screen.findByTestId("plan-invalid")).toHaveTextContent(/"lots" is not a quantity/);
    expect(screen.queryByTestId("plan-results")).toBeNull();
    await fireEvent.changeText(screen.getByTestId("plan-wash-0-volume"), "0.025 L");
    await screen.findByTestId("plan-results");
  });

  it("saves the plan with the document the API expects, then opens it", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(routes({ id: "p-7", title: "Amide coupling work-up, 10 mmol" }), calls) as typeof fetch;
    await renderWith(<PlanScreen />);
    await fireEvent.press(await screen.findByTestId("plan-load-example"));
    await fireEvent.press(screen.getByTestId("plan-save-button"));
    await waitFor(() => expect(mockPush).toHaveBeenCalledWith("/plan/p-7"));
    const post = calls.find((c) => c.method === "POST")!;
    const body = post.body as { title: string; input: Record<string, unknown> & { washes: { aqueous: unknown; volumeMl: number; repeats: number }[]; recovery: unknown } };
    expect(body.title).toBe("Amide coupling work-up, 10 mmol");
    expect(body.input.organic).toEqual({ solvent: "ethyl-acetate", volumeMl: 80 });
    expect(body.input.washes[0]).toEqual({ aqueous: { solute: "hydrochloric-acid", concentration: { value: 1, unit: "mol/L" } }, volumeMl: 25, repeats: 2 });
    expect(body.input.washes[1]!.aqueous).toEqual({ solute: "sodium-bicarbonate", concentration: "saturated" });
    expect(body.input.recovery).toEqual({ component: "aryl acid (unreacted)", reagent: { solute: "hydrochloric-acid", concentration: { value: 6, unit: "mol/L" } } });
    expect(body.input.evaporation).toEqual({ vaporTemperatureC: 30 });
  });

  it("refuses to save without a title and says so", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(routes({}), calls) as typeof fetch;
    await renderWith(<PlanScreen />);
    await fireEvent.press(await screen.findByTestId("plan-load-example"));
    await fireEvent.changeText(screen.getByTestId("plan-title"), "  ");
    await fireEvent.press(screen.getByTestId("plan-save-button"));
    expect(screen.getByTestId("plan-save-error")).toHaveTextContent("Give the plan a title first.");
    expect(calls.some((c) => c.method === "POST")).toBe(false);
  });
});

describe("SavedPlanScreen", () => {
  it("shows someone else's plan read-only, with its results and a copy button instead of save", async () => {
    mockParams = { id: "p-9" };
    const plan = {
      id: "p-9",
      title: "Lead's amine strip",
      notes: "Checked on the 250 mL funnel.",
      solvent: "EtOAc",
      componentNames: ["amine A"],
      washCount: 1,
      author: { id: "u-lead", name: "Tomas Reyne" },
      updatedBy: null,
      createdAt: "2026-03-01T10:00:00.000Z",
      updatedAt: "2026-03-01T10:00:00.000Z",
      canEdit: false,
      input: {
        organic: { solvent: "EtOAc", volumeMl: 50 },
        components: [{ name: "amine A", kind: "base", pKa: 9.5, partitionCoefficient: 40, amountMmol: 4 }],
        washes: [{ aqueous: { solute: "HCl", concentration: { value: 1, unit: "mol/L" } }, volumeMl: 20, repeats: 2 }],
        temperatureC: 20,
      },
    };
    global.fetch = fakeFetch({ "GET /api/me": () => ({ status: 200, body: ME }), "GET /api/plans/p-9": () => ({ status: 200, body: plan }) }, []) as typeof fetch;
    await renderWith(<SavedPlanScreen />);
    await screen.findByTestId("plan-read-only");
    expect(screen.getByText("Checked on the 250 mL funnel.")).toBeTruthy();
    expect(screen.queryByTestId("plan-save-button")).toBeNull();
    expect(screen.queryByTestId("plan-delete")).toBeNull();
    // 50 mL + 20 mL = 70 mL ≤ ¾ × 125 mL
    expect(screen.getByTestId("plan-funnel-size")).toHaveTextContent(/^125 mL$/);
    await fireEvent.press(screen.getByTestId("plan-copy"));
    expect(mockNavigate).toHaveBeenCalledWith("/plan");
  });

  it("says a plan of another group does not exist here", async () => {
    mockParams = { id: "elsewhere" };
    global.fetch = fakeFetch({ "GET /api/me": () => ({ status: 200, body: ME }) }, []) as typeof fetch;
    await renderWith(<SavedPlanScreen />);
    expect(await screen.findByText("No such plan in your group")).toBeTruthy();
  });
});
