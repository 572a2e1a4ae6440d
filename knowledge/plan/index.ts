/** Extraction plan: acid–base washes, passes, recovery, funnel, rotary evaporation, solvent choice. */
export { PLAN_SOURCES, allSources, planSourceEntry } from "./sources";
export { PKA_TABLE, findPka, searchPka, type IonisableKind, type PkaEntry } from "./pka";
export {
  EMPTY_MIXTURE,
  PKW_25C,
  combineMixtures,
  effectiveTotalMolL,
  meanCharge,
  mixturePh,
  netCharge,
  scaleMixture,
  solvePh,
  speciesFractions,
  type AqueousMixture,
  type ProticSystem,
} from "./acid-base";
export {
  ACTIVITY_NOTE,
  CARBONIC_PKAS,
  WASH_CHEMISTRY,
  co2SaturationMolL,
  resolveWash,
  washChemistryFor,
  washMixture,
  washMolarity,
  washPh,
  type WashChemistry,
  type WashMolarity,
  type WashPh,
  type WashRole,
  type WashSystem,
} from "./wash-chemistry";
export {
  LOGP_ESTIMATE_NOTE,
  distributionCurve,
  distributionRatio,
  equilibratePass,
  fractionLeftInOrganic,
  fractionNeutral,
  ionisedDemandMmol,
  partitionCoefficientOf,
  type ComponentKind,
  type EquilibriumComponent,
  type EquilibriumResult,
} from "./distribution";
export {
  compareOneVersusSplit,
  fractionLeftAfterPasses,
  fractionLeftCurve,
  fractionLeftPerPass,
  passesForRecovery,
  type PassesForRecovery,
  type PortionComparison,
  type RepeatedExtraction,
} from "./passes";
export {
  EXOTHERM_CAUTION,
  GAS_CONSTANT_J_PER_MOL_K,
  MIXTURE_HEAT_CAPACITY_J_PER_G_K,
  NEUTRALISATION_ENTHALPY_KJ_PER_MOL,
  VENTING_CAUTION,
  gasMlPerMmol,
  neutraliseExtract,
  type ExtractComponent,
  type NeutraliseInput,
  type NeutraliseResult,
} from "./neutralise";
export { FUNNEL_SIZES_ML, MAX_FILL_FRACTION, chooseFunnel, type FunnelChoice } from "./funnel";
export {
  LOW_BOILER_C,
  MBAR_PER_MMHG,
  RULE_STEP_C,
  boilingPointAtPressureC,
  evaporationCautions,
  evaporationSettings,
  vapourPressureMbar,
  type EvaporationInput,
  type EvaporationSettings,
} from "./evaporation";
export {
  GUIDE_ORDER,
  SUBSTITUTION_CHECKLIST,
  greenerSubstitutes,
  rankSolvents,
  type RankedSolvent,
  type SolventConstraints,
  type Substitute,
  type SubstituteAdvice,
} from "./solvent-choice";
export {
  GREASY_PARTITION_COEFFICIENT,
  LITRES_OF_GAS_ML,
  MAX_REPEATS,
  REMOVED_BY_MIN_FRACTION,
  computePlan,
  type PlanComponentInput,
  type PlanInput,
  type PlanResult,
  type PlanStep,
  type PlanStepComponent,
  type PlanWashInput,
} from "./plan";
