import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { render, screen, waitFor } from "@testing-library/react-native";
import { CasesScreen } from "../../components/cases/cases-screen";
import { removeDraft } from "../../hooks/use-draft";
import type { CaseListResponse, CaseSummary } from "../../knowledge/contracts/cases";

jest.mock("expo-router", () => ({
  useRouter: () => ({ push: jest.fn(), replace: jest.fn() }),
  useLocalSearchParams: () => ({}),
  Link: ({ children }: { children: React.ReactNode }) => children,
}));

const me = {
  user: { id: "u-ash", email: "ash@larchmere.example", name: "Ash" },
  groups: [{ id: "g-larch", name: "Larchmere Process Group", slug: "larchmere", role: "chemist" }],
  activeGroupId: "g-larch",
};

const summary: CaseSummary = {
  id: "case-1",
  title: "Milky band after bicarbonate wash",
  status: "open",
  authorId: "u-ash",
  authorName: "Ash",
  occurredAt: "2025-03-14T10:00:00.000Z",
  createdAt: "2025-03-14T10:00:00.000Z",
  updatedAt: "2025-03-14T10:00:00.000Z",
  solvents: ["ethyl acetate"],
  aqueousLabel: "saturated sodium bicarbonate",
  solventFamily: "ester",
  phBand: "6-9",
  kind: "milky-band",
  causes: [],
  tags: [],
  attemptCount: 0,
  photoCount: 0,
  thumbnailUrl: null,
  whatWorked: null,
  bestOutcome: null,
  verified: false,
  retired: false,
  following: false,
};

/** Only the network boundary is faked. */
function fakeServer(list: Omit<CaseListResponse, "limit" | "offset">) {
  return jest.fn(async (input: RequestInfo | URL) => {
    const path = new URL(String(input instanceof Request ? input.url : input), "http://localhost").pathname;
    const body =
      path === "/api/me" ? me : path === "/api/groups/g-larch/members" ? { members: [], yourRole: "chemist" } : path === "/api/cases" ? { ...list, limit: 50, offset: 0 } : null;
    return body
      ? new Response(JSON.stringify(body), { status: 200, headers: { "content-type": "application/json" } })
      : new Response(JSON.stringify({ error: { code: "not_found", message: "no route" } }), { status: 404 });
  });
}

describe("the case list's count", () => {
  const realFetch = global.fetch;
  const clients: QueryClient[] = [];
  afterEach(async () => {
    await screen.unmount();
    global.fetch = realFetch;
    for (const c of clients.splice(0)) c.clear();
    removeDraft("cases-list:u-ash");
  });

  async function show(list: Omit<CaseListResponse, "limit" | "offset">) {
    const server = fakeServer(list);
    global.fetch = server as unknown as typeof fetch;
    const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    clients.push(client);
    await render(
      <QueryClientProvider client={client}>
        <CasesScreen />
      </QueryClientProvider>,
    );
    // Settled: the account, the group's members and the list have all answered.
    await waitFor(() => expect(server).toHaveBeenCalledTimes(3));
  }

  it('says "1000+ cases" when the server stopped counting', async () => {
    await show({ cases: [summary], total: 1000, totalIsLowerBound: true });
    expect(await screen.findByTestId("cases-count")).toHaveTextContent(/^1000\+ cases/);
    expect(screen.getByTestId("cases-more")).toHaveTextContent("Show more");
    expect(screen.getByTestId("cases-more")).not.toHaveTextContent(/left/);
  });

  it("gives an exact count and what is left otherwise", async () => {
    await show({ cases: [summary], total: 1234, totalIsLowerBound: false });
    expect(await screen.findByTestId("cases-count")).toHaveTextContent(/^1234 cases/);
    expect(screen.getByTestId("cases-more")).toHaveTextContent("Show more (1233 left)");
  });
});
