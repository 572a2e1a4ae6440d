import { Redirect, Slot } from "expo-router";
import { Shell } from "../../components/shell/shell";
import { Loading } from "../../components/ui/states";
import { authClient } from "../../hooks/auth-client";

/** Signed-in area. The guard is a convenience: the server enforces access on every route. */
export default function AppLayout() {
  const session = authClient.useSession();
  if (session.isPending) return <Loading />;
  if (!session.data) return <Redirect href="/sign-in" />;
  return (
    <Shell>
      <Slot />
    </Shell>
  );
}
