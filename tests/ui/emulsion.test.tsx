import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react-native";
import { buildRequest, computeLocally } from "../../components/emulsion/answers";
import { EmulsionHelp } from "../../components/emulsion/emulsion-screen";
import { decodeCasePrefill } from "../../hooks/case-prefill";
import { readDraft, removeDraft, writeDraft } from "../../hooks/use-draft";
import type { TroubleshootResponse } from "../../knowledge/contracts/emulsion";

const mockPush = jest.fn();
jest.mock("expo-router", () => ({
  useRouter: () => ({ push: mockPush, replace: jest.fn() }),
  Link: ({ children }: { children: React.ReactNode }) => children,
}));

type Call = { url: string; method: string; body: unknown };

const me = (groups: { id: string; name: string; slug: string; role: string }[]) => ({
  user: { id: "u-kit", email: "kit@larchmere.example", name: "Kit" },
  groups,
  activeGroupId: groups[0]?.id ?? null,
});

/** Only the network boundary is faked: a tiny server keyed by path. */
function fakeServer(routes: Record<string, (body: unknown) => unknown>, calls: Call[]) {
  return jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input instanceof Request ? input.url : input);
    const body = init?.body ? JSON.parse(String(init.body)) : undefined;
    calls.push({ url, method: init?.method ?? "GET", body });
    const path = new URL(url).pathname;
    const handler = routes[path];
    if (!handler) return new Response(JSON.stringify({ error: { code: "not_found", message: "no route" } }), { status: 404 });
    return new Response(JSON.stringify(handler(body)), { status: 200, headers: { "content-type": "application/json" } });
  });
}

const clients: QueryClient[] = [];
function ui(owner: string) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  clients.push(client);
  return (
    <QueryClientProvider client={client}>
      <EmulsionHelp owner={owner} />
    </QueryClientProvider>
  );
}

/** The walk a chemist makes: DCM 50 mL over 1 M NaOH 50 mL, a quarter emulsified, solids, a fatty acid. */
async function answerDcmOverNaoh() {
  await fireEvent.changeText(screen.getByTestId("emulsion-solvent-0-search"), "DCM");
  await fireEvent.press(screen.getByTestId("emulsion-solvent-0-option-dichloromethane"));
  await fireEvent.press(screen.getByTestId("emulsion-organic-volume-0-pick-50 mL"));
  await fireEvent.press(screen.getByTestId("emulsion-solute-option-sodium-hydroxide-1 M"));
  await fireEvent.press(screen.getByTestId("emulsion-aqueous-volume-pick-50 mL"));
  await fireEvent.press(screen.getByTestId("emulsion-fraction-25"));
  await fireEvent.press(screen.getByTestId("emulsion-seen-flag-solids"));
  await fireEvent.press(screen.getByTestId("emulsion-reagent-fatty-acid"));
  await fireEvent.press(screen.getByTestId("emulsion-funnel-size-250"));
}

const rankOf = (id: string) => {
  const card = screen.getByTestId(`remedy-${id}`);
  return within(card).getByLabelText(/^Number \d+$/).props.accessibilityLabel as string;
};

describe("Emulsion help", () => {
  const realFetch = global.fetch;
  let n = 0;
  let owner = "";
  beforeEach(() => {
    n += 1;
    owner = `ui-${n}`;
    mockPush.mockReset();
  });
  afterEach(() => {
    global.fetch = realFetch;
    for (const c of clients.splice(0)) c.clear();
    for (const k of ["answers", "stage", "recent"]) removeDraft(`emulsion.${k}.${owner}`);
  });

  it("asks for the funnel before ranking, then ranks on the device with no group: causes first, filter pad on top", async () => {
    const calls: Call[] = [];
    global.fetch = fakeServer({ "/api/me": () => me([]) }, calls) as typeof fetch;
    await render(ui(owner));

    await fireEvent.press(screen.getByTestId("emulsion-show"));
    expect(screen.getByTestId("emulsion-errors")).toHaveTextContent(/Pick the organic solvent/);
    expect(screen.queryByTestId("emulsion-results")).toBeNull();

    await answerDcmOverNaoh();
    await fireEvent.press(screen.getByTestId("emulsion-show"));
    await screen.findByTestId("emulsion-results");
    // DCM 1.327 g/mL (CRC) sinks below 1 M NaOH, 1.041 g/mL (CRC): 0.286 g/mL apart
    expect(screen.getByTestId("emulsion-layers")).toHaveTextContent("Bottom layer: organic — Dichloromethane, 1.327 g/mL");
    expect(screen.getByTestId("cause-chlorinated-base")).toBeTruthy();
    expect(screen.getByTestId("cause-fine-solids")).toHaveTextContent(/solids seen at the interface/i);
    expect(rankOf("filter-pad")).toBe("Number 1");
    expect(screen.getByTestId("remedy-filter-pad-minutes")).toHaveTextContent("10–30 min");
    expect(screen.getByTestId("emulsion-provenance")).toHaveTextContent(/Ranked on this device/);
    // no group: nothing asked of the server
    expect(calls.filter((c) => c.url.includes("/api/troubleshoot"))).toHaveLength(0);

    // The brine card's after-line: 13 mL saturated brine (25 % of 50 mL), organic stays at the bottom,
    // (50·1.041 + 13·1.197) / 63 = 1.073 g/mL aqueous → gap 0.253, (50 + 63) / 250 mL = 45 % full.
    await fireEvent.press(screen.getByTestId("emulsion-more-remedies"));
    expect(screen.getByTestId("remedy-saturated-brine-after")).toHaveTextContent(
      "After 13 mL saturated brine: organic still on the bottom, Δρ 0.253 g/mL, funnel 45 % full",
    );

    // DCM boils at 39.6 °C: the 40 °C bath is ruled out, shown with its warning, never ranked
    const ruledOut = screen.getByTestId("emulsion-ruled-out");
    expect(within(ruledOut).getByTestId("remedy-warm-bath-warning")).toHaveTextContent(/Do not warm: dichloromethane boils at 39.6 °C/);
    expect(within(screen.getByTestId("remedy-warm-bath")).queryByLabelText(/^Number/)).toBeNull();

    // steps fold open, scaled to the funnel, with their sources
    await fireEvent.press(screen.getByTestId("remedy-filter-pad-toggle"));
    const details = screen.getByTestId("remedy-filter-pad-details");
    expect(details).toHaveTextContent(/Rinse the pad with 10 mL/);
    expect(details).toHaveTextContent(/Method 3510C/);
    // the centrifuge's one-line caution defers to the SDS
    expect(screen.getByTestId("remedy-centrifuge-caution")).toHaveTextContent(/follow the SDS and local rules/);
  });

  it("with a group, shows the server's answer: cleared n of m on the card", async () => {
    const calls: Call[] = [];
    const server = (body: unknown): TroubleshootResponse => {
      const local = computeLocally(body as Parameters<typeof computeLocally>[0]);
      if (!local.ok) throw new Error("bad request in test");
      const remedies = local.answer.remedies.map((r) => (r.id === "centrifuge" ? { ...r, evidence: { cleared: 2, tried: 3, smoothedRate: 0.69 } } : r));
      return { ...local.answer, remedies, groupEvidence: true };
    };
    global.fetch = fakeServer({ "/api/me": () => me([{ id: "g-larch", name: "Larchmere Process Group", slug: "larch", role: "chemist" }]), "/api/troubleshoot": server }, calls) as typeof fetch;
    await render(ui(owner));
    await answerDcmOverNaoh();
    await fireEvent.press(screen.getByTestId("emulsion-show"));

    await waitFor(() => expect(screen.getByTestId("emulsion-provenance")).toHaveTextContent(/Includes your group.s logged cases/), { timeout: 5000 });
    expect(screen.getByTestId("remedy-centrifuge-evidence")).toHaveTextContent("Cleared 2 of 3 in this group");
    const sent = calls.find((c) => c.url.endsWith("/api/troubleshoot"));
    expect(sent?.method).toBe("POST");
    expect(sent?.body).toEqual({
      system: {
        organic: [{ solvent: "dichloromethane", volumeMl: 50 }],
        aqueous: { solute: "sodium-hydroxide", volumeMl: 50, concentration: { value: 1, unit: "mol/L" } },
        temperatureC: 20,
      },
      seen: { emulsionFractionPct: 25, solids: true },
      known: { reagents: ["fatty-acid"], funnelMl: 250 },
    });
  });

  it("keeps the answers when the screen goes away, and starts a case with the system and what was seen", async () => {
    global.fetch = fakeServer({ "/api/me": () => me([]) }, []) as typeof fetch;
    const first = await render(ui(owner));
    await answerDcmOverNaoh();
    await fireEvent.press(screen.getByTestId("emulsion-show"));
    await first.unmount();
    expect(readDraft<{ reagents: string[] }>(`emulsion.answers.${owner}`)?.data.reagents).toEqual(["fatty-acid"]);

    await render(ui(owner));
    await screen.findByTestId("emulsion-results");
    await fireEvent.press(screen.getByTestId("emulsion-start-case"));
    const href = String(mockPush.mock.calls[0]?.[0]);
    expect(href.startsWith("/cases/new?system=")).toBe(true);
    const prefill = decodeCasePrefill(new URLSearchParams(href.split("?")[1]).get("system"));
    expect(prefill?.organic).toEqual([{ solvent: "dichloromethane", volumeMl: 50 }]);
    expect(prefill?.aqueous).toEqual({ solute: "sodium-hydroxide", volumeMl: 50, concentration: { value: 1, unit: "mol/L" } });
    expect(prefill?.seen).toEqual({ emulsionFractionPct: 25, solids: true });
    expect(prefill?.tags).toEqual(["fatty-acid"]);

    // and the system is offered next time as a recent one
    await fireEvent.press(screen.getByTestId("emulsion-edit"));
    expect(screen.getByTestId("emulsion-system-summary")).toHaveTextContent("DCM 50 mL · 1 M NaOH 50 mL");
  });

  it("starts from the layer check open on this device", async () => {
    global.fetch = fakeServer({ "/api/me": () => me([]) }, []) as typeof fetch;
    // what the Layers screen keeps as its open check
    writeDraft(`layers.check.${owner}`, {
      organic: [{ solvent: "ethyl-acetate", volume: "40 mL" }],
      dissolved: "",
      aqueous: { solute: "sodium-bicarbonate", concentration: "saturated", volume: "20 mL" },
      temperature: "20 °C",
    });
    try {
      await render(ui(owner));
      await fireEvent.press(screen.getByTestId("emulsion-start-layer-check"));
      expect(screen.getByTestId("emulsion-system-summary")).toHaveTextContent("EtOAc 40 mL · sat. NaHCO3 20 mL");
      await fireEvent.press(screen.getByTestId("emulsion-show"));
      // ethyl acetate (0.900 g/mL, CRC) floats on saturated bicarbonate
      expect((await screen.findByTestId("emulsion-layers")).props.children).toMatch(/^Bottom layer: aqueous — Sodium bicarbonate/);
    } finally {
      removeDraft(`layers.check.${owner}`);
    }
  });

  it("reads what is typed the forgiving way: 0.05 L and 'sat.' brine", () => {
    const built = buildRequest({
      organic: [{ solvent: "ethyl-acetate", volumeText: "0.05 L" }],
      aqueous: { solute: "sodium-chloride", concentrationText: "sat.", volumeText: "25 mL" },
      temperatureText: "",
      funnelMl: null,
      emulsifiedPct: null,
      seen: [],
      phText: "",
      coSolvents: ["THF"],
      reagents: [],
      shaking: null,
      minutesWaited: null,
      product: { name: "", kind: null, pKaText: "", logPText: "" },
    });
    expect(built.ok && built.request).toEqual({
      system: { organic: [{ solvent: "ethyl-acetate", volumeMl: 50 }], aqueous: { solute: "sodium-chloride", volumeMl: 25, concentration: "saturated" } },
      seen: {},
      known: { coSolvents: ["THF"] },
    });
  });
});
