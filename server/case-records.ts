import { phBand as bandOfPh } from "../knowledge/emulsion/evidence";
import { predictLayers } from "../knowledge/layers";
import { washPh } from "../knowledge/plan/wash-chemistry";
import { SHIPPED_REFERENCE, findSolute, findSolvent } from "../knowledge/reference";
import type { ReferenceData, Solvent } from "../knowledge/types";
import { KnowledgeInputError } from "../knowledge/types";
import type {
  AttemptOutcome,
  CaseAttempt,
  CasePhBand,
  CasePhoto,
  CasePredictedLayers,
  CaseSummary,
  CaseSystem,
  CaseSystemInput,
  CreateCaseParsed,
  EmulsionKind,
  CaseStatus,
} from "../knowledge/contracts/cases";
import type { Database } from "../db/client";
import { caseAttempts, caseFollowers, type casePhotos, cases } from "../db/schema";
import { badRequest } from "./middleware/errors";

/*
 * Case records: resolving a logged system against the reference tables, the derived columns
 * the filters and the similar-case match use, and the rows → response shapes.
 */

export type CaseRow = Omit<typeof cases.$inferSelect, "searchVector" | "searchText">;
export type AttemptRow = typeof caseAttempts.$inferSelect;
export type PhotoRow = typeof casePhotos.$inferSelect;

export interface DerivedSystem {
  system: CaseSystem;
  solventKeys: string[];
  aqueousKey: string | null;
  solventFamily: string | null;
  phBand: CasePhBand | null;
  predicted: CasePredictedLayers | null;
}

/**
 * The extraction solvent: the water-immiscible solvent with the largest volume (a THF reaction
 * diluted with EtOAc is an ester case). The emulsion help picks its "main" solvent the same way.
 */
function mainSolvent(parts: { solvent: Solvent | undefined; volumeMl: number }[]): Solvent | undefined {
  const known = parts.filter((p): p is { solvent: Solvent; volumeMl: number } => p.solvent !== undefined);
  const byVolume = [...known].sort((a, b) => b.volumeMl - a.volumeMl);
  return (byVolume.find((p) => p.solvent.miscibility.value !== "miscible") ?? byVolume[0])?.solvent;
}

/** Measured pH when given, else the fresh wash's pH from its acid–base data (knowledge/plan/wash-chemistry). */
function casePhBand(input: CaseSystemInput["aqueous"], soluteKey: string | null, ref: ReferenceData): CasePhBand | null {
  if (input.ph !== undefined) return bandOfPh(input.ph);
  if (!soluteKey) return null;
  try {
    return bandOfPh(washPh(soluteKey, input.concentration, ref).pH);
  } catch (e) {
    // No acid–base entry, or no concentration given for a salt: the band stays unknown.
    if (e instanceof KnowledgeInputError) return null;
    throw e;
  }
}

/**
 * Resolves names through the reference tables (any synonym), computes the predicted layer order
 * when every name is known, and the signature columns. Unknown names are kept as typed: a case
 * can log a solvent the tables lack; it then has no prediction.
 */
export function deriveSystem(input: CaseSystemInput, ref: ReferenceData = SHIPPED_REFERENCE): DerivedSystem {
  const parts = input.organic.map((p) => ({ input: p, solvent: findSolvent(p.solvent, ref) }));
  const solute = findSolute(input.aqueous.solute, ref);
  const temperatureC = input.temperatureC ?? 20;
  const system: CaseSystem = {
    organic: parts.map(({ input: p, solvent }) => ({
      solvent: p.solvent,
      volumeMl: p.volumeMl,
      key: solvent?.key ?? null,
      name: solvent?.name ?? p.solvent,
      family: solvent?.family ?? null,
    })),
    aqueous: {
      solute: input.aqueous.solute,
      ...(input.aqueous.concentration !== undefined ? { concentration: input.aqueous.concentration } : {}),
      volumeMl: input.aqueous.volumeMl,
      ...(input.aqueous.ph !== undefined ? { ph: input.aqueous.ph } : {}),
      key: solute?.key ?? null,
      name: solute?.name ?? input.aqueous.solute,
    },
    temperatureC,
    ...(input.scale ? { scale: input.scale } : {}),
  };
  const main = mainSolvent(parts.map((p) => ({ solvent: p.solvent, volumeMl: p.input.volumeMl })));
  let predicted: CasePredictedLayers | null = null;
  if (solute && parts.every((p) => p.solvent)) {
    try {
      const p = predictLayers(
        {
          organic: parts.map((x) => ({ solvent: x.solvent!.key, volumeMl: x.input.volumeMl })),
          aqueous: {
            solute: solute.key,
            ...(input.aqueous.concentration !== undefined ? { concentration: input.aqueous.concentration } : {}),
            volumeMl: input.aqueous.volumeMl,
          },
          temperatureC,
        },
        ref,
      );
      predicted = {
        phases: p.phases,
        top: p.top,
        bottom: p.bottom,
        organicDensityGPerMl: p.organicDensityGPerMl,
        aqueousDensityGPerMl: p.aqueousDensityGPerMl,
        densityDifferenceGPerMl: p.densityDifferenceGPerMl,
        confidence: p.confidence,
      };
    } catch (e) {
      if (!(e instanceof KnowledgeInputError)) throw e;
      // An impossible concentration is the chemist's typo: say so. A missing concentration or a
      // temperature outside the tables only means there is no prediction.
      if (e.field.startsWith("aqueous.concentration") && input.aqueous.concentration !== undefined) {
        throw badRequest(e.message, { "system.aqueous.concentration": e.message });
      }
    }
  }
  return {
    system,
    solventKeys: [...new Set(parts.flatMap((p) => (p.solvent ? [p.solvent.key] : [])))],
    aqueousKey: solute?.key ?? null,
    solventFamily: main?.family ?? null,
    phBand: casePhBand(input.aqueous, solute?.key ?? null, ref),
    predicted,
  };
}

/** Inverse of deriveSystem's input part: the stored system as a create/patch body would send it. */
export function systemInputOf(system: CaseSystem): CaseSystemInput {
  return {
    organic: system.organic.map((p) => ({ solvent: p.solvent, volumeMl: p.volumeMl })),
    aqueous: {
      solute: system.aqueous.solute,
      ...(system.aqueous.concentration !== undefined ? { concentration: system.aqueous.concentration } : {}),
      volumeMl: system.aqueous.volumeMl,
      ...(system.aqueous.ph !== undefined ? { ph: system.aqueous.ph } : {}),
    },
    temperatureC: system.temperatureC,
    ...(system.scale ? { scale: system.scale } : {}),
  };
}

export function aqueousLabel(system: CaseSystem): string {
  const c = system.aqueous.concentration;
  const name = system.aqueous.name.toLowerCase() === "water" ? "water" : system.aqueous.name.toLowerCase();
  if (c === undefined) return name;
  if (c === "saturated") return `saturated ${name}`;
  return `${c.value} ${c.unit === "%w/w" ? "% w/w" : c.unit} ${name}`;
}

// ── remedies in words ───────────────────────────────────────────────────────

/** Short labels and "cleared …" phrases for the catalogue's remedy ids (knowledge/emulsion/model.ts REMEDY_IDS). */
const REMEDY_WORDS: Record<string, { label: string; how: string }> = {
  "let-stand": { label: "Standing", how: "on standing" },
  "swirl-interface": { label: "Gentle swirling", how: "by gentle swirling" },
  "saturated-brine": { label: "Saturated brine", how: "with saturated brine" },
  "solid-salt": { label: "Solid salt", how: "with solid salt" },
  "more-organic": { label: "More organic solvent", how: "with more organic solvent" },
  "dilute-aqueous": { label: "Diluting the aqueous layer", how: "by diluting the aqueous layer" },
  "little-alcohol": { label: "A little alcohol", how: "with a little alcohol" },
  "filter-pad": { label: "Filtering through a pad", how: "by filtering through diatomaceous earth" },
  centrifuge: { label: "Centrifuging", how: "by centrifuging" },
  "adjust-ph": { label: "Adjusting the pH", how: "by adjusting the pH" },
  "warm-bath": { label: "Gentle warming", how: "by gentle warming" },
  "chill-freeze-thaw": { label: "Cooling or freeze–thaw", how: "by cooling" },
  ultrasound: { label: "Ultrasound bath", how: "in an ultrasound bath" },
  "strip-cosolvent": { label: "Removing the co-solvent", how: "by removing the co-solvent" },
  "dry-organic": { label: "Drying the organic layer", how: "by drying the organic layer" },
  "phase-separator-paper": { label: "Phase-separator paper", how: "through phase-separator paper" },
  "tartrate-chelation": { label: "Tartrate wash", how: "with a tartrate wash" },
  "copper-ammonia-wash": { label: "Ammonia or EDTA wash", how: "with an ammonia or EDTA wash" },
  "gentle-vacuum-degas": { label: "Letting the gas out", how: "by letting the gas out" },
  "drain-band": { label: "Draining the band apart", how: "by draining the band apart" },
  "swap-solvent": { label: "Changing the solvent", how: "by changing the solvent" },
};

function humanise(id: string): string {
  const words = id.replace(/-/g, " ");
  return words.charAt(0).toUpperCase() + words.slice(1);
}

export function remedyLabel(remedyId: string | null, description: string | null): string {
  if (remedyId) return REMEDY_WORDS[remedyId]?.label ?? humanise(remedyId);
  const d = (description ?? "").trim();
  return d.length > 60 ? `${d.slice(0, 59)}…` : d;
}

function remedyHow(remedyId: string | null, description: string | null): string {
  if (remedyId) return REMEDY_WORDS[remedyId]?.how ?? `with ${humanise(remedyId).toLowerCase()}`;
  return `with “${remedyLabel(null, description)}”`;
}

function minutesText(minutes: number | null): string {
  if (minutes === null) return "";
  const m = Math.round(minutes * 10) / 10;
  return ` after ${m} min`;
}

const OUTCOME_RANK: Record<AttemptOutcome, number> = { cleared: 3, partly: 2, "no-change": 1, worse: 0 };

export function bestOutcome(attempts: Pick<AttemptRow, "outcome">[]): AttemptOutcome | null {
  let best: AttemptOutcome | null = null;
  for (const a of attempts) {
    const o = a.outcome as AttemptOutcome;
    if (best === null || OUTCOME_RANK[o] > OUTCOME_RANK[best]) best = o;
  }
  return best;
}

/**
 * At a glance: the first attempt that cleared ("cleared with saturated brine after 10 min"),
 * else the first that partly cleared; null when nothing has helped yet.
 */
export function whatWorked(attempts: Pick<AttemptRow, "position" | "remedyId" | "description" | "minutes" | "outcome">[]): string | null {
  const ordered = [...attempts].sort((a, b) => a.position - b.position);
  const cleared = ordered.find((a) => a.outcome === "cleared");
  if (cleared) return `cleared ${remedyHow(cleared.remedyId, cleared.description)}${minutesText(cleared.minutes)}`;
  const partly = ordered.find((a) => a.outcome === "partly");
  if (partly) return `partly cleared ${remedyHow(partly.remedyId, partly.description)}${minutesText(partly.minutes)}`;
  return null;
}

// ── search text ──────────────────────────────────────────────────────────────

/**
 * Everything the search box should find a case by, lower case: title, notes, tags, components,
 * every name of its solvents and aqueous phase (so "DCM" and "methylene chloride" both hit a case
 * logged as dichloromethane), remedies tried with their descriptions and notes, and the outcome.
 */
export function buildSearchText(
  row: Pick<CaseRow, "title" | "notes" | "tags" | "causes" | "components" | "system" | "finalOutcome">,
  attempts: Pick<AttemptRow, "remedyId" | "description" | "note" | "amount">[],
  ref: ReferenceData = SHIPPED_REFERENCE,
): string {
  const names: string[] = [];
  for (const p of row.system.organic) {
    const s = p.key ? ref.solvents.find((x) => x.key === p.key) : undefined;
    names.push(p.solvent, ...(s ? [s.name, s.key, ...s.synonyms] : []));
  }
  const aq = row.system.aqueous.key ? ref.solutes.find((x) => x.key === row.system.aqueous.key) : undefined;
  names.push(row.system.aqueous.solute, ...(aq ? [aq.name, ...aq.synonyms] : []));
  const remedies = attempts.flatMap((a) => [
    a.remedyId ?? "",
    a.remedyId ? remedyLabel(a.remedyId, null) : "",
    a.description ?? "",
    a.amount ?? "",
    a.note ?? "",
  ]);
  return [
    row.title,
    row.notes,
    row.tags.join(" "),
    row.causes.join(" "),
    row.components.map((c) => c.name).join(" "),
    [...new Set(names)].join(" "),
    remedies.join(" "),
    row.finalOutcome ?? "",
  ]
    .map((s) => s.trim())
    .filter((s) => s !== "")
    .join(" \n")
    .toLowerCase();
}

// ── rows → responses ─────────────────────────────────────────────────────────

const iso = (d: Date) => d.toISOString();

export function toAttempt(row: AttemptRow, authorName: string): CaseAttempt {
  return {
    id: row.id,
    caseId: row.caseId,
    position: row.position,
    remedyId: row.remedyId,
    label: remedyLabel(row.remedyId, row.description),
    description: row.description,
    amount: row.amount,
    minutes: row.minutes,
    outcome: row.outcome as AttemptOutcome,
    note: row.note,
    authorId: row.authorId,
    authorName,
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
  };
}

export function photoUrl(id: string): string {
  return `/api/photos/${id}`;
}

export function toPhoto(row: PhotoRow): CasePhoto {
  return {
    id: row.id,
    caseId: row.caseId,
    url: photoUrl(row.id),
    thumbnailUrl: `${photoUrl(row.id)}/thumbnail`,
    mimeType: row.mimeType,
    sizeBytes: row.sizeBytes,
    width: row.width,
    height: row.height,
    uploadedBy: row.uploadedBy,
    createdAt: iso(row.createdAt),
  };
}

export interface SummaryExtras {
  authorName: string;
  attempts: Pick<AttemptRow, "position" | "remedyId" | "description" | "minutes" | "outcome">[];
  photoCount: number;
  firstPhotoId: string | null;
  following: boolean;
}

export function toSummary(row: CaseRow, x: SummaryExtras): CaseSummary {
  const mainFirst = [...row.system.organic].sort((a, b) => b.volumeMl - a.volumeMl).map((p) => p.name);
  return {
    id: row.id,
    title: row.title,
    status: row.status as CaseStatus,
    authorId: row.authorId,
    authorName: x.authorName,
    occurredAt: iso(row.occurredAt),
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
    solvents: mainFirst,
    aqueousLabel: aqueousLabel(row.system),
    solventFamily: row.solventFamily,
    phBand: row.phBand as CasePhBand | null,
    kind: row.emulsionKind as EmulsionKind | null,
    causes: row.causes,
    tags: row.tags,
    attemptCount: x.attempts.length,
    photoCount: x.photoCount,
    thumbnailUrl: x.firstPhotoId ? `${photoUrl(x.firstPhotoId)}/thumbnail` : null,
    whatWorked: whatWorked(x.attempts),
    bestOutcome: bestOutcome(x.attempts),
    verified: row.verified,
    retired: row.retired,
    following: x.following,
  };
}

// ── writing ──────────────────────────────────────────────────────────────────

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

/**
 * Inserts a parsed case with its attempts (in order) inside the caller's transaction; the
 * author follows it from the start, so they hear about attempts others add.
 */
export async function insertCase(
  tx: Tx,
  args: { groupId: string; authorId: string; body: CreateCaseParsed; now?: Date; verifiedBy?: string },
): Promise<string> {
  const { groupId, authorId, body } = args;
  const now = args.now ?? new Date();
  const derived = deriveSystem(body.system);
  const id = crypto.randomUUID();
  const values = {
    id,
    groupId,
    authorId,
    title: body.title,
    system: derived.system,
    solventKeys: derived.solventKeys,
    aqueousKey: derived.aqueousKey,
    solventFamily: derived.solventFamily,
    phBand: derived.phBand,
    tags: [...new Set(body.tags)],
    causes: [...new Set(body.causes)],
    components: body.components,
    predicted: derived.predicted,
    observedBottom: body.observedBottom,
    seen: body.seen,
    emulsionKind: body.seen.kind,
    notes: body.notes,
    status: body.status,
    finalOutcome: body.finalOutcome,
    recovery: body.recovery,
    occurredAt: body.occurredAt ? new Date(body.occurredAt) : now,
    createdAt: now,
    updatedAt: now,
    ...(args.verifiedBy ? { verified: true, verifiedBy: args.verifiedBy, verifiedAt: now } : {}),
  };
  const attempts: AttemptRow[] = body.attempts.map((a, i) => ({
    id: crypto.randomUUID(),
    caseId: id,
    groupId,
    position: i + 1,
    remedyId: a.remedyId,
    description: a.description ?? null,
    amount: a.amount ?? null,
    minutes: a.minutes ?? null,
    outcome: a.outcome,
    note: a.note ?? null,
    authorId,
    createdAt: now,
    updatedAt: now,
  }));
  await tx.insert(cases).values({ ...values, searchText: buildSearchText(values, attempts) });
  if (attempts.length) await tx.insert(caseAttempts).values(attempts);
  await tx.insert(caseFollowers).values({ caseId: id, userId: authorId, createdAt: now });
  return id;
}
