import { Redirect, Stack, useGlobalSearchParams, usePathname } from "expo-router";
import { safeReturnTo } from "../../components/auth/return-to";
import { authClient } from "../../hooks/auth-client";
import { Loading } from "../../components/ui/states";

export default function AuthLayout() {
  const session = authClient.useSession();
  const pathname = usePathname();
  const { next } = useGlobalSearchParams<{ next?: string }>();
  if (session.isPending) return <Loading />;
  // A reset link opened while signed in still sets the new password; other auth pages move on.
  if (session.data && pathname !== "/reset-password") return <Redirect href={safeReturnTo(next) as never} />;
  return <Stack screenOptions={{ headerShown: false }} />;
}
