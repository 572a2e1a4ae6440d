import { useLocalSearchParams, useRouter } from "expo-router";
import { useMemo } from "react";
import { decodeCasePrefill, PREFILL_PARAM } from "../../hooks/case-prefill";
import { useActiveGroup, useMeQuery } from "../../hooks/use-me";
import { Button } from "../ui/button";
import { Screen } from "../ui/screen";
import { Empty, Loading } from "../ui/states";
import { CaseForm } from "./case-form";

/** /cases/new, optionally with ?system=… from the Layers or Emulsion screen. */
export function NewCaseScreen() {
  const params = useLocalSearchParams<{ [PREFILL_PARAM]?: string }>();
  const prefill = useMemo(() => decodeCasePrefill(params[PREFILL_PARAM]), [params]);
  const me = useMeQuery();
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
      ) : me.isPending ? (
        <Loading />
      ) : (
        <Empty
          title="Cases belong to a lab group"
          body="Join your group or start one; its members then read every case you log."
          action={<Button label="Open Group" onPress={() => router.navigate("/group" as never)} />}
        />
      )}
    </Screen>
  );
}
