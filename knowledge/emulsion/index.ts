export { CAUSES, causeByCode } from "./causes";
export { REMEDIES, remedyById, benchAmount } from "./remedies";
export { PREVENTION_TIPS, preventionFor, type PreventionTip } from "./prevention";
export { EMULSION_SOURCES, emulsionSource, isEmulsionSourceKey, type EmulsionSourceEntry } from "./sources";
export {
  CAUSE_CODES,
  REMEDY_IDS,
  REAGENT_TAGS,
  type CauseCode,
  type RemedyId,
  type ReagentTag,
  type EvidenceLevel,
  type EmulsionCause,
  type Remedy,
  type RemedyAmounts,
  type EmulsionSystem,
  type Seen,
  type Known,
  type Component,
  type TroubleshootInput,
} from "./model";
export {
  troubleshoot,
  type TroubleshootOptions,
  type TroubleshootResult,
  type CauseResult,
  type RemedyResult,
  type GroupNote,
} from "./diagnose";
export {
  PH_BANDS,
  PRIOR_STRENGTH,
  OUTCOME_CREDIT,
  phBand,
  smoothedRate,
  ownGroupRecords,
  isSimilar,
  remedyEvidence,
  type PhBand,
  type EvidenceRecord,
  type EvidenceOutcome,
  type CaseSignature,
  type RemedyEvidence,
} from "./evidence";
export {
  brineAfter,
  solidSaltAfter,
  waterAfter,
  organicAfter,
  componentsAtPh,
  neutralisationEffect,
  warmingCheck,
  warmedAfter,
  vapourPressureKPa,
  saltToSaturationG,
  saltingCanInvert,
  saturatedBrineDensityGPerMl,
  DEFAULT_BATH_C,
  type PhaseAfter,
  type ComponentMove,
  type ComponentCheck,
  type NeutralisationEffect,
  type WarmingCheck,
  type WarmingVerdict,
} from "./side-effects";
export { systemFacts, type SystemFacts } from "./facts";
export { remedyAmounts } from "./amounts";
export { remedyCatalogue, catalogueEntry, CATALOGUE_SYSTEM, CATALOGUE_SCALE_NOTE, type CatalogueEntry } from "./catalogue";
