import { useLocalSearchParams, useRouter } from "expo-router";
import { ApiError } from "../../hooks/api";
import { useCaseQuery } from "../../hooks/use-cases";
import { useActiveGroup } from "../../hooks/use-me";
import { Button } from "../ui/button";
import { Screen } from "../ui/screen";
import { Empty, ErrorState, Loading } from "../ui/states";
import { CaseDetailView } from "./case-detail";

/** /cases/:id */
export function CaseScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const q = useCaseQuery(id);
  const group = useActiveGroup();
  const router = useRouter();
  const back = <Button label="All cases" variant="secondary" onPress={() => router.navigate("/cases" as never)} testID="case-back" />;
  if (q.isPending) {
    return (
      <Screen title="Case" actions={back}>
        <Loading label="Loading the case…" />
      </Screen>
    );
  }
  if (q.isError) {
    const missing = q.error instanceof ApiError && q.error.status === 404;
    return (
      <Screen title="Case" actions={back}>
        {missing ? (
          <Empty title="No such case in your group" body="It may belong to another group, or the link is mistyped." />
        ) : (
          <ErrorState error={q.error} onRetry={() => q.refetch()} />
        )}
      </Screen>
    );
  }
  return (
    <Screen title={q.data.title} actions={back}>
      <CaseDetailView detail={q.data} userId={group?.userId ?? ""} />
    </Screen>
  );
}
