import { useMemo } from "react";
import { useGroupReference } from "../../hooks/use-group-reference";
import { evaluateEvaporation, evaluatePlan, evaluateRecovery, type PlanDraft } from "./plan-draft";

/**
 * A draft computed in the browser with the tables the group computes with (the shipped ones
 * plus the lead's active corrections), as the server's plan route does.
 */
export function usePlanEvaluation(draft: PlanDraft | null) {
  const ref = useGroupReference();
  const evaluation = useMemo(() => (draft ? evaluatePlan(draft, ref) : null), [draft, ref]);
  const recovery = useMemo(() => (draft && evaluation ? evaluateRecovery(draft, evaluation, ref) : null), [draft, evaluation, ref]);
  const evaporation = useMemo(() => (draft && evaluation ? evaluateEvaporation(draft, evaluation, ref) : null), [draft, evaluation, ref]);
  return { evaluation, recovery, evaporation, ref };
}
