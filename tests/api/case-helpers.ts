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

/** The names a fixture case is logged with, and the reference key each one must resolve to. */
export const FIXTURE_SOLVENTS = [
  { typed: "dichloromethane", key: "dichloromethane" },
  { typed: "DCM", key: "dichloromethane" },
  { typed: "methylene chloride", key: "dichloromethane" },
  { typed: "ethyl acetate", key: "ethyl-acetate" },
  { typed: "EtOAc", key: "ethyl-acetate" },
  { typed: "toluene", key: "toluene" },
  { typed: "MTBE", key: "mtbe" },
  { typed: "2-MeTHF", key: "2-methyltetrahydrofuran" },
] as const;

export const FIXTURE_AQUEOUS = [
  { typed: "sat. NaHCO3", concentration: "saturated", key: "sodium-bicarbonate" },
  { typed: "brine", concentration: "saturated", key: "sodium-chloride" },
  { typed: "HCl", concentration: { value: 1, unit: "mol/L" }, key: "hydrochloric-acid" },
  { typed: "NaOH", concentration: { value: 1, unit: "mol/L" }, key: "sodium-hydroxide" },
  { typed: "water", concentration: undefined, key: "water" },
  { typed: "NH4Cl", concentration: "saturated", key: "ammonium-chloride" },
] as const;

export const FIXTURE_REMEDIES = ["saturated-brine", "filter-pad", "let-stand", "solid-salt", "adjust-ph"] as const;
export const FIXTURE_OUTCOMES = ["cleared", "partly", "no-change", "worse"] as const;
export const FIXTURE_STATUSES = ["open", "resolved", "abandoned"] as const;
const TITLES = ["Rag layer at the interface", "Milky band after shaking", "Hazy organic layer", "Foam after bicarbonate wash", "Third layer in the funnel"];
const KINDS = ["rag-with-solids", "milky-band", "hazy-organic", "foam", "three-layers"] as const;

export interface FixtureCase {
  i: number;
  solvent: (typeof FIXTURE_SOLVENTS)[number];
  aqueous: (typeof FIXTURE_AQUEOUS)[number];
  remedy: (typeof FIXTURE_REMEDIES)[number];
  outcome: (typeof FIXTURE_OUTCOMES)[number];
  status: (typeof FIXTURE_STATUSES)[number];
  title: string;
  /** every seventh case says "emulsion" in its notes */
  saysEmulsion: boolean;
  phaseTransfer: boolean;
  occurredAt: string;
  body: CreateCaseBody;
}

/** A deterministic set of cases cycling through solvents, aqueous phases, remedies, outcomes and statuses. */
export function fixtureCases(n: number, label = ""): FixtureCase[] {
  return Array.from({ length: n }, (_, i) => {
    const solvent = FIXTURE_SOLVENTS[i % FIXTURE_SOLVENTS.length]!;
    const aqueous = FIXTURE_AQUEOUS[i % FIXTURE_AQUEOUS.length]!;
    const remedy = FIXTURE_REMEDIES[i % FIXTURE_REMEDIES.length]!;
    const outcome = FIXTURE_OUTCOMES[i % FIXTURE_OUTCOMES.length]!;
    const status = FIXTURE_STATUSES[i % FIXTURE_STATUSES.length]!;
    const title = `${TITLES[i % TITLES.length]} ${label}#${i}`;
    const saysEmulsion = i % 7 === 0;
    const phaseTransfer = i % 9 === 0;
    const occurredAt = new Date(Date.UTC(2025, 0, 1 + i, 14, 30)).toISOString();
    const body: CreateCaseBody = {
      title,
      system: {
        organic: [{ solvent: solvent.typed, volumeMl: 80 + i }],
        aqueous: { solute: aqueous.typed, ...(aqueous.concentration ? { concentration: aqueous.concentration } : {}), volumeMl: 40 },
        temperatureC: 20,
      },
      tags: phaseTransfer ? ["phase-transfer-catalyst"] : ["acid-base-wash"],
      causes: [i % 2 === 0 ? "fine-solids" : "surfactant-soap"],
      seen: { kind: KINDS[i % KINDS.length]! },
      notes: saysEmulsion ? "A stubborn emulsion held for twenty minutes." : "Slow to settle, drained carefully.",
      status,
      occurredAt,
      attempts: [{ remedyId: remedy, minutes: 10, outcome }],
    };
    return { i, solvent, aqueous, remedy, outcome, status, title, saysEmulsion, phaseTransfer, occurredAt, body };
  });
}
