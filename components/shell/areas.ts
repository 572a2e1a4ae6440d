/*
 * Every signed-in screen but Home, gathered so that the routes can load them as one chunk
 * (area-screen.tsx). Add a new area's screen here and route to it with areaScreen("...").
 */
export { CaseScreen } from "../cases/case-screen";
export { CasesScreen } from "../cases/cases-screen";
export { NewCaseScreen } from "../cases/new-case-screen";
export { DeskScreen } from "../desk/desk-screen";
export { OutboxScreen } from "../dev/outbox-screen";
export { EmulsionScreen } from "../emulsion/emulsion-screen";
export { GroupScreen } from "../group/group-screen";
export { LayerCheckScreen } from "../layers/layer-check-screen";
export { BenchCardScreen } from "../plan/bench-card-screen";
export { PlanScreen } from "../plan/plan-screen";
export { SavedPlanScreen } from "../plan/saved-plan-screen";
export { SolventChoiceScreen } from "../plan/solvent-choice-screen";
export { SolventsScreen } from "../solvents/solvents-screen";
