import type { ReviewCheck } from "../knowledge/contracts/curation";
import { SHIPPED_REFERENCE } from "../knowledge/reference";
import type { ReferenceData } from "../knowledge/types";
import type { AttemptRow, CaseRow } from "./case-records";

/*
 * What a lead looks at before verifying (domain brief §6.2 "Verify": a complete record, a
 * plausible layer order, a safety screen, a photo, no hidden product loss). The thresholds are
 * common practice, not sourced limits.
 */

/** Gentle warming means a bath of about 40 °C; within 10 °C of a solvent's boiling point it boils in the funnel (common practice). */
const WARM_BATH_C = 40;
const BATH_MARGIN_C = 10;
/** GHS flammable liquids, categories 1 and 2: flash point below 23 °C (UN GHS chapter 2.6; from memory). */
const FLAMMABLE_FLASH_POINT_C = 23;
/** Practices the safety screen names (domain brief §6.2): open flames and heat guns near a funnel. */
const HOT_WORDS = /\b(heat ?gun|hot ?plate|bunsen|torch|flame)\b/i;

type Attempt = Pick<AttemptRow, "remedyId" | "description" | "note" | "outcome">;

function solventsOf(row: CaseRow, ref: ReferenceData) {
  return row.system.organic.flatMap((p) => {
    const s = p.key ? ref.solvents.find((x) => x.key === p.key) : undefined;
    return s ? [s] : [];
  });
}

function safetyChecks(row: CaseRow, attempts: Attempt[], ref: ReferenceData): ReviewCheck[] {
  const out: ReviewCheck[] = [];
  const solvents = solventsOf(row, ref);
  if (attempts.some((a) => a.remedyId === "warm-bath")) {
    const low = solvents.filter((s) => s.boilingPointC.value <= WARM_BATH_C + BATH_MARGIN_C);
    if (low.length) {
      out.push({
        code: "safety",
        tone: "danger",
        message: `Warmed with ${low.map((s) => `${s.name} (bp ${s.boilingPointC.value} °C)`).join(", ")} in the funnel: check it was vented and never stoppered while warm.`,
      });
    }
  }
  if (attempts.some((a) => a.remedyId === "centrifuge")) {
    const flammable = solvents.filter((s) => s.flashPointC.value !== null && s.flashPointC.value < FLAMMABLE_FLASH_POINT_C);
    if (flammable.length) {
      out.push({
        code: "safety",
        tone: "caution",
        message: `Centrifuged ${flammable.map((s) => s.name).join(", ")} (flash point below ${FLAMMABLE_FLASH_POINT_C} °C): confirm the centrifuge is rated for flammables.`,
      });
    }
  }
  if (attempts.some((a) => HOT_WORDS.test(`${a.description ?? ""} ${a.note ?? ""}`))) {
    out.push({ code: "safety", tone: "danger", message: "An attempt mentions an open heat source near the funnel: check against local rules before this is advice." });
  }
  return out;
}

/** The checks for one case, most serious first. */
export function reviewChecks(row: CaseRow, attempts: Attempt[], photoCount: number, ref: ReferenceData = SHIPPED_REFERENCE): ReviewCheck[] {
  const checks: ReviewCheck[] = safetyChecks(row, attempts, ref);
  if (row.phBand === null) checks.push({ code: "no-ph", tone: "caution", message: "No pH recorded, and none could be worked out from the wash." });
  else if (row.system.aqueous.ph === undefined) checks.push({ code: "no-ph", tone: "info", message: "pH worked out from the wash, not measured." });
  if (row.predicted?.bottom && row.observedBottom && row.predicted.bottom !== row.observedBottom) {
    checks.push({
      code: "layer-surprise",
      tone: "caution",
      message: `Observed ${row.observedBottom} at the bottom, predicted ${row.predicted.bottom}: check the solvents and concentrations.`,
    });
  }
  const emulsified = row.emulsionKind !== null && row.emulsionKind !== "none";
  if (attempts.length === 0 && emulsified) checks.push({ code: "no-attempts", tone: "caution", message: "No attempts logged yet." });
  if (row.status === "resolved" && !attempts.some((a) => a.outcome === "cleared")) {
    checks.push({ code: "no-fix", tone: "caution", message: "Resolved, but no attempt is marked as cleared." });
  }
  if (row.status !== "open" && row.finalOutcome === null && row.recovery === null) {
    checks.push({ code: "no-outcome", tone: "info", message: "No final outcome or recovery: ask whether product was lost to the pad or the aqueous layer." });
  }
  if (photoCount === 0) checks.push({ code: "no-photo", tone: "info", message: "No photo." });
  const rank = { danger: 0, caution: 1, info: 2 } as const;
  return checks.sort((a, b) => rank[a.tone] - rank[b.tone]);
}
