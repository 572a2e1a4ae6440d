import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor } from "@testing-library/react-native";
import { CaseForm } from "../../components/cases/case-form";
import { caseStartHref, decodeCasePrefill, type CasePrefill } from "../../hooks/case-prefill";
import { readDraft, removeDraft } from "../../hooks/use-draft";
import { createCaseBody } from "../../knowledge/contracts/cases";

type Call = { url: string; method: string; body: unknown };

/** Only the network boundary is faked. */
function fakeFetch(status: number, payload: unknown, calls: Call[]) {
  return jest.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    calls.push({
      url: String(input instanceof Request ? input.url : input),
      method: init?.method ?? "GET",
      body: init?.body ? JSON.parse(String(init.body)) : undefined,
    });
    return new Response(JSON.stringify(payload), { status, headers: { "content-type": "application/json" } });
  });
}

const clients: QueryClient[] = [];

function ui(draftKey: string, onCreated = jest.fn(), prefill: CasePrefill | null = null) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  clients.push(client);
  return (
    <QueryClientProvider client={client}>
      <CaseForm draftKey={draftKey} onCreated={onCreated} prefill={prefill} />
    </QueryClientProvider>
  );
}

const created = { id: "case-1", title: "Dichloromethane over sodium bicarbonate" };

/** Type into a table picker and take the row for `key` (any synonym finds it). */
async function pick(testID: string, typed: string, key: string) {
  await fireEvent.changeText(screen.getByTestId(`${testID}-search`), typed);
  await fireEvent.press(screen.getByTestId(`${testID}-option-${key}`));
}

describe("CaseForm", () => {
  const realFetch = global.fetch;
  let n = 0;
  let key = "";
  beforeEach(() => {
    n += 1;
    key = `test-${n}`;
  });
  afterEach(() => {
    global.fetch = realFetch;
    removeDraft(key);
    // Drop cached mutations so their clean-up timers do not hold the process open.
    clients.splice(0).forEach((c) => c.clear());
  });

  it("keeps what was typed when the screen goes away and brings it back with a notice", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(200, created, calls) as typeof fetch;
    const first = await render(ui(key));
    await pick("organic-0-solvent", "methylene chloride", "dichloromethane");
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "0.5 L");
    // The common "Saturated NaHCO3" row brings its concentration with it.
    await fireEvent.press(screen.getByTestId("aqueous-solute-option-sodium-bicarbonate-saturated"));
    await fireEvent.press(screen.getByTestId("observed-aqueous"));
    await first.unmount();

    const stored = readDraft<{ organic: { solvent: string; volume: string }[]; observedBottom: string }>(key);
    expect(stored?.data.organic[0]).toMatchObject({ solvent: "dichloromethane", volume: "0.5 L" });
    expect(stored?.data.observedBottom).toBe("aqueous");

    await render(ui(key));
    expect(screen.getByTestId("draft-restored")).toBeTruthy();
    expect(screen.getByTestId("organic-0-solvent-chosen")).toHaveTextContent(/Dichloromethane/);
    expect(screen.getByTestId("organic-0-volume").props.value).toBe("0.5 L");
    expect(screen.getByTestId("aqueous-solute-chosen")).toHaveTextContent(/Sodium bicarbonate/);
    expect(screen.getByTestId("aqueous-concentration").props.value).toBe("saturated");
    expect(calls).toHaveLength(0);
  });

  it("refuses to send an empty system and names each missing field", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(200, created, calls) as typeof fetch;
    await render(ui(key));
    await fireEvent.press(screen.getByTestId("case-save"));
    const errors = screen.getByTestId("case-errors");
    expect(errors).toHaveTextContent(/Solvent: Name the solvent\./);
    expect(errors).toHaveTextContent(/Solvent volume: Give the volume/);
    expect(errors).toHaveTextContent(/Aqueous solution: Name the aqueous phase/);
    expect(errors).toHaveTextContent(/Aqueous volume: Give the volume/);
    expect(calls).toHaveLength(0);
  });

  it("rejects a volume it cannot read and a volume of zero, keeping the typed text", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(200, created, calls) as typeof fetch;
    await render(ui(key));
    await pick("organic-0-solvent", "DCM", "dichloromethane");
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "fifty");
    await pick("aqueous-solute", "water", "water");
    await fireEvent.changeText(screen.getByTestId("aqueous-volume"), "0");
    await fireEvent.press(screen.getByTestId("case-save"));
    expect(screen.getByTestId("case-errors")).toHaveTextContent(/Solvent volume: "fifty" is not a quantity/);
    expect(screen.getByTestId("case-errors")).toHaveTextContent(/Aqueous volume: The volume must be more than 0 mL\./);
    expect(screen.getByTestId("organic-0-volume").props.value).toBe("fifty");
    expect(calls).toHaveLength(0);
  });

  it("sends canonical units in the contract's shape, then forgets the draft", async () => {
    const calls: Call[] = [];
    global.fetch = fakeFetch(201, created, calls) as typeof fetch;
    const onCreated = jest.fn();
    await render(ui(key, onCreated));
    await pick("organic-0-solvent", "DCM", "dichloromethane");
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "0.5 L");
    await fireEvent.press(screen.getByTestId("aqueous-solute-option-sodium-bicarbonate-saturated"));
    await fireEvent.press(screen.getByTestId("aqueous-volume-pick-100 mL"));
    await fireEvent.changeText(screen.getByTestId("temperature"), "25 °C");
    await fireEvent.press(screen.getByTestId("kind-milky-band"));
    await fireEvent.press(screen.getByTestId("observed-organic"));
    await fireEvent.press(screen.getByTestId("case-save"));

    await waitFor(() => expect(onCreated).toHaveBeenCalledWith(created));
    expect(calls).toHaveLength(1);
    expect(calls[0]?.url).toMatch(/\/api\/cases$/);
    expect(calls[0]?.method).toBe("POST");
    const body = createCaseBody.parse(calls[0]?.body);
    // 0.5 L is 500 mL; "saturated" is the contract's literal; the title is suggested from the system.
    expect(body.system.organic).toEqual([{ solvent: "dichloromethane", volumeMl: 500 }]);
    expect(body.system.aqueous).toEqual({ solute: "sodium-bicarbonate", concentration: "saturated", volumeMl: 100 });
    expect(body.system.temperatureC).toBe(25);
    expect(body.observedBottom).toBe("organic");
    expect(body.seen.kind).toBe("milky-band");
    expect(body.title).toBe("Emulsion: dichloromethane over saturated sodium bicarbonate");
    expect(readDraft(key)).toBeNull();
  });

  it("puts the server's field errors on the fields and keeps the input and the draft", async () => {
    const calls: Call[] = [];
    const refusal = { error: { code: "bad_request", message: "Some fields need attention.", fields: { "system.organic.0.volumeMl": "The volume must be more than 0 mL." } } };
    global.fetch = fakeFetch(400, refusal, calls) as typeof fetch;
    const onCreated = jest.fn();
    await render(ui(key, onCreated));
    await pick("organic-0-solvent", "EtOAc", "ethyl-acetate");
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "40");
    await pick("aqueous-solute", "brine", "sodium-chloride");
    await fireEvent.changeText(screen.getByTestId("aqueous-volume"), "40 mL");
    await fireEvent.press(screen.getByTestId("case-save"));

    await waitFor(() => expect(screen.getByTestId("case-errors")).toHaveTextContent(/Solvent volume: The volume must be more than 0 mL\./));
    expect(calls).toHaveLength(1);
    expect(onCreated).not.toHaveBeenCalled();
    expect(screen.getByTestId("organic-0-solvent-chosen")).toHaveTextContent(/Ethyl acetate/);
    expect(readDraft<{ aqueous: { volume: string } }>(key)?.data.aqueous.volume).toBe("40 mL");
  });

  it("keeps everything when the connection drops during the save", async () => {
    global.fetch = jest.fn(async () => {
      throw new TypeError("Network request failed");
    }) as typeof fetch;
    await render(ui(key));
    // A solvent the tables do not hold is typed freely and kept as typed.
    await fireEvent.press(screen.getByTestId("organic-0-solvent-type"));
    await fireEvent.changeText(screen.getByTestId("organic-0-solvent-free"), "limonene");
    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "30");
    await pick("aqueous-solute", "water", "water");
    await fireEvent.changeText(screen.getByTestId("aqueous-volume"), "30");
    await fireEvent.press(screen.getByTestId("case-save"));
    await waitFor(() => expect(screen.getByTestId("case-save-error")).toHaveTextContent(/Your entries are kept here/));
    expect(readDraft<{ organic: { solvent: string; freeText?: boolean }[] }>(key)?.data.organic[0]).toMatchObject({ solvent: "limonene", freeText: true });
    expect(screen.getByTestId("organic-0-solvent-free").props.value).toBe("limonene");
    expect(screen.getByTestId("case-save")).toBeTruthy();
  });

  it("starts from a Start-a-case link, and a restored draft wins over it until asked", async () => {
    global.fetch = fakeFetch(200, created, []) as typeof fetch;
    const href = caseStartHref({
      organic: [{ solvent: "ethyl-acetate", volumeMl: 80 }],
      aqueous: { solute: "sodium-chloride", concentration: "saturated", volumeMl: 25 },
      temperatureC: 22,
      causes: ["fine-solids"],
    });
    const prefill = decodeCasePrefill(new URL(`http://x${href}`).searchParams.get("system"));
    const first = await render(ui(key, jest.fn(), prefill));
    expect(screen.getByTestId("prefilled")).toBeTruthy();
    expect(screen.getByTestId("organic-0-solvent-chosen")).toHaveTextContent(/Ethyl acetate/);
    expect(screen.getByTestId("organic-0-volume").props.value).toBe("80 mL");
    expect(screen.getByTestId("aqueous-concentration").props.value).toBe("saturated");
    expect(screen.getByTestId("temperature").props.value).toBe("22 °C");
    expect(screen.getByTestId("cause-fine-solids").props.accessibilityState).toMatchObject({ checked: true });

    await fireEvent.changeText(screen.getByTestId("organic-0-volume"), "120 mL");
    await first.unmount();
    await render(ui(key, jest.fn(), prefill));
    expect(screen.getByTestId("organic-0-volume").props.value).toBe("120 mL");
    await fireEvent.press(screen.getByTestId("draft-use-link"));
    expect(screen.getByTestId("organic-0-volume").props.value).toBe("80 mL");
  });
});
