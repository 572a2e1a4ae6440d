import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { renderHook, waitFor } from "@testing-library/react-native";
import { examplePlan } from "../../components/plan/plan-draft";
import { usePlanEvaluation } from "../../components/plan/use-plan-evaluation";
import { SHIPPED_REFERENCE, findSolvent } from "../../knowledge/reference";

/*
 * The plan screens compute in the browser with the group's tables: a solvent the lead added as
 * a correction (p-cymene here, density 0.857 g/mL at 20 °C from its SDS, from memory) is usable
 * in a plan for the group's members, and unknown to the shipped tables.
 */

const ME = {
  user: { id: "u-kit", email: "kit@larchmere.example", name: "Kit Ambrose" },
  groups: [{ id: "g1", name: "Larchmere Process Group", slug: "larchmere", role: "chemist" }],
  activeGroupId: "g1",
};

const toluene = findSolvent("toluene")!;
const cymene = { ...toluene, key: "p-cymene", name: "p-Cymene", synonyms: ["cymene"], cas: "99-87-6", formula: "C10H14", densityGPerMl20C: { value: 0.857, source: "group SDS" } };
const OVERRIDES = {
  overrides: [{ id: "o-1", applies: true, payload: { kind: "solvent-new", solvent: cymene } }],
};

function withFetch(overrides: unknown) {
  global.fetch = jest.fn(async (input: RequestInfo | URL) => {
    const path = new URL(String(input instanceof Request ? input.url : input), "http://localhost").pathname;
    const body = path === "/api/me" ? ME : path === "/api/reference/overrides" ? overrides : { error: { code: "not_found", message: path } };
    return new Response(JSON.stringify(body), { status: body && "error" in (body as object) ? 404 : 200, headers: { "content-type": "application/json" } });
  }) as typeof fetch;
}

const realFetch = global.fetch;
afterEach(() => {
  global.fetch = realFetch;
});

function wrapper({ children }: { children: React.ReactNode }) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}

const cymenePlan = { ...examplePlan(), solvent: "p-cymene" };

describe("plan computed with the group's corrections", () => {
  it("uses a solvent the group added, which the shipped tables do not know", async () => {
    expect(findSolvent("p-cymene", SHIPPED_REFERENCE)).toBeUndefined();
    withFetch(OVERRIDES);
    const { result } = await renderHook(() => usePlanEvaluation(cymenePlan), { wrapper });
    await waitFor(() => expect(result.current.evaluation?.status).toBe("ok"));
    expect(result.current.ref.solvents.some((s) => s.key === "p-cymene")).toBe(true);
  });

  it("refuses the same plan where the group has no such correction", async () => {
    withFetch({ overrides: [] });
    const { result } = await renderHook(() => usePlanEvaluation(cymenePlan), { wrapper });
    await waitFor(() => expect(global.fetch).toHaveBeenCalledWith(expect.stringContaining("/api/reference/overrides"), expect.anything()));
    expect(result.current.evaluation?.status).toBe("invalid");
  });
});
