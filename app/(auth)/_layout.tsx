import { Redirect, Stack } from "expo-router";
import { authClient } from "../../hooks/auth-client";
import { Loading } from "../../components/ui/states";

export default function AuthLayout() {
  const session = authClient.useSession();
  if (session.isPending) return <Loading />;
  if (session.data) return <Redirect href="/" />;
  return <Stack screenOptions={{ headerShown: false }} />;
}
