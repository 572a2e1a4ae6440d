import type { CreateCaseBody } from "../../knowledge/contracts/cases";
import type { Agent } from "./harness";

/** A small amide-coupling work-up: DCM over saturated bicarbonate with a rag layer. */
export function couplingCase(overrides: Partial<CreateCaseBody> = {}): CreateCaseBody {
  return {
    title: "Rag layer after amide coupling wash",
    system: {
      organic: [{ solvent: "DCM", volumeMl: 100 }],
      aqueous: { solute: "sat. NaHCO3", concentration: "saturated", volumeMl: 50 },
      temperatureC: 20,
    },
    tags: ["amide-coupling"],
    causes: ["fine-solids"],
    observedBottom: "organic",
    seen: { kind: "rag-with-solids", emulsionFractionPct: 15, solids: true, colour: "off-white" },
    notes: "Urea by-product sat at the interface as a white rag.",
    ...overrides,
  };
}

export async function createCase(agent: Agent, body: CreateCaseBody = couplingCase()) {
  const res = await agent.post("/api/cases").send(body);
  if (res.status !== 201) throw new Error(`case create failed: ${res.status} ${res.text}`);
  return res.body as { id: string } & Record<string, unknown>;
}
