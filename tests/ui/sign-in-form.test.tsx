import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor } from "@testing-library/react-native";
import { SignInForm } from "../../components/auth/sign-in-form";

const mockReplace = jest.fn();
let mockParams: Record<string, string> = {};
jest.mock("expo-router", () => ({
  useRouter: () => ({ replace: mockReplace, canDismiss: () => false, dismissTo: jest.fn() }),
  useGlobalSearchParams: () => mockParams,
  Link: ({ children }: { children: React.ReactNode }) => children,
}));

type Call = { url: string; body: unknown };

/** Only the network boundary is faked: better-auth's client calls fetch. */
function fakeFetch(status: number, payload: unknown, calls: Call[]) {
  return jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    calls.push({ url: String(input instanceof Request ? input.url : input), body: init?.body ? JSON.parse(String(init.body)) : undefined });
    return new Response(JSON.stringify(payload), { status, headers: { "content-type": "application/json" } });
  });
}

async function renderForm(onSignedIn: jest.Mock | null = jest.fn()) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  await render(
    <QueryClientProvider client={client}>
      <SignInForm onSignedIn={onSignedIn ?? undefined} />
    </QueryClientProvider>,
  );
  return onSignedIn;
}

describe("SignInForm", () => {
  const realFetch = global.fetch;
  afterEach(() => {
    global.fetch = realFetch;
    mockReplace.mockReset();
    mockParams = {};
  });

  it("asks for both fields before calling the server", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(200, {}, calls) as typeof fetch;
    await renderForm();
    await fireEvent.press(screen.getByTestId("sign-in-submit"));
    expect(screen.getByTestId("sign-in-error")).toHaveTextContent("Enter your e-mail and password.");
    expect(calls).toHaveLength(0);
  });

  it("shows a mismatch message and keeps the typed e-mail when the password is wrong", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(401, { code: "INVALID_EMAIL_OR_PASSWORD", message: "Invalid email or password" }, calls) as typeof fetch;
    const onSignedIn = await renderForm();
    await fireEvent.changeText(screen.getByTestId("sign-in-email"), " kit@bench.example ");
    await fireEvent.changeText(screen.getByTestId("sign-in-password"), "wrong-one");
    await fireEvent.press(screen.getByTestId("sign-in-submit"));
    await waitFor(() => expect(screen.getByTestId("sign-in-error")).toHaveTextContent("That e-mail and password do not match."));
    expect(calls[0]?.url).toMatch(/\/api\/auth\/sign-in\/email$/);
    expect(calls[0]?.body).toEqual({ email: "kit@bench.example", password: "wrong-one" });
    expect(screen.getByTestId("sign-in-email").props.value).toBe(" kit@bench.example ");
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it("reports success to its caller when the server accepts", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(200, { token: "t", user: { id: "u1", email: "kit@bench.example", name: "Kit" } }, calls) as typeof fetch;
    const onSignedIn = await renderForm();
    await fireEvent.changeText(screen.getByTestId("sign-in-email"), "kit@bench.example");
    await fireEvent.changeText(screen.getByTestId("sign-in-password"), "right-one-1");
    await fireEvent.press(screen.getByTestId("sign-in-submit"));
    await waitFor(() => expect(onSignedIn).toHaveBeenCalledTimes(1));
    expect(screen.queryByTestId("sign-in-error")).toBeNull();
  });

  it.each([
    ["/layers?o=toluene%3A30", "/layers?o=toluene%3A30"],
    ["//elsewhere.example/x", "/"],
    ["https://elsewhere.example/", "/"],
  ])("after signing in with next=%s goes to %s", async (next, expected) => {
    mockParams = { next };
    global.fetch = fakeFetch(200, { token: "t", user: { id: "u1", email: "kit@bench.example", name: "Kit" } }, []) as typeof fetch;
    await renderForm(null);
    await fireEvent.changeText(screen.getByTestId("sign-in-email"), "kit@bench.example");
    await fireEvent.changeText(screen.getByTestId("sign-in-password"), "right-one-1");
    await fireEvent.press(screen.getByTestId("sign-in-submit"));
    await waitFor(() => expect(mockReplace).toHaveBeenCalledWith(expected));
  });
});
