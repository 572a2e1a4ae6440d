import { createAuthClient } from "better-auth/react";
import { organizationClient } from "better-auth/client/plugins";

/** better-auth's client on the same origin as the app. */
export const authClient = createAuthClient({
  baseURL: typeof window !== "undefined" && window.location?.origin ? window.location.origin : "http://localhost:3000",
  basePath: "/api/auth",
  // Resolve fetch at call time, so the one network boundary can be swapped (tests, offline queue).
  fetchOptions: { customFetchImpl: (input, init) => globalThis.fetch(input, init) },
  plugins: [organizationClient()],
});
