import { useLocalSearchParams, useRouter } from "expo-router";
import { useMemo } from "react";
import { decodeCasePrefill, PREFILL_PARAM } from "../../hooks/case-prefill";
import { useActiveGroup } from "../../hooks/use-me";
import { Screen } from "../ui/screen";
import { Loading } from "../ui/states";
import { CaseForm } from "./case-form";

/** /cases/new, optionally with ?system=… from the Layers or Emulsion screen. */
export function NewCaseScreen() {
  const params = useLocalSearchParams<{ [PREFILL_PARAM]?: string }>();
  const prefill = useMemo(() => decodeCasePrefill(params[PREFILL_PARAM]), [params]);
  const group = useActiveGroup();
  const router = useRouter();
  return (
    <Screen title="Log a case" subtitle="The system, what you see, a photo: the rest can wait.">
      {group ? (
        <CaseForm
          draftKey={`case-new:${group.userId}:${group.id}`}
          prefill={prefill}
          onCreated={(c) => router.replace(`/cases/${c.id}` as never)}
        />
      ) : (
        <Loading />
      )}
    </Screen>
  );
}
