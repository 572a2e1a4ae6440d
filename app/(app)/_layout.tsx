import { Redirect, Slot, useGlobalSearchParams, usePathname } from "expo-router";
import { useEffect } from "react";
import { returnPathOf, takeLandingPath } from "../../components/auth/return-to";
import { Shell } from "../../components/shell/shell";
import { Loading } from "../../components/ui/states";
import { authClient } from "../../hooks/auth-client";

/** Signed-in area. The guard is a convenience: the server enforces access on every route. */
export default function AppLayout() {
  const session = authClient.useSession();
  const pathname = usePathname();
  const params = useGlobalSearchParams();
  const signedIn = !!session.data;
  // Signed in already: the landing address has served its purpose (a later sign-out starts afresh).
  useEffect(() => {
    if (signedIn) takeLandingPath();
  }, [signedIn]);
  if (session.isPending) return <Loading />;
  if (!session.data) {
    // Come back here after signing in (a shared link opened signed out keeps its page and inputs).
    const next = returnPathOf(pathname, params) ?? takeLandingPath();
    return <Redirect href={(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in") as never} />;
  }
  return (
    <Shell>
      <Slot />
    </Shell>
  );
}
