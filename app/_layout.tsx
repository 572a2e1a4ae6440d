import { QueryClientProvider } from "@tanstack/react-query";
import { useFonts } from "expo-font";
import { Stack } from "expo-router";
import { useState } from "react";
import { SafeAreaProvider } from "react-native-safe-area-context";
import { createQueryClient } from "../hooks/query-client";
import { fonts } from "../hooks/theme";

export default function RootLayout() {
  const [client] = useState(createQueryClient);
  const [loaded, failed] = useFonts({
    [fonts.regular]: require("../assets/fonts/AtkinsonHyperlegible_400Regular.ttf"),
    [fonts.bold]: require("../assets/fonts/AtkinsonHyperlegible_700Bold.ttf"),
  });
  if (!loaded && !failed) return null;
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={client}>
        <Stack screenOptions={{ headerShown: false }} />
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}
