import { createAuthClient } from "better-auth/react";

/**
 * better-auth's client on the same origin as the app: sessions, sign-in, sign-up, password reset.
 * Groups go through the app's own /api/groups routes, so no organization client plugin is loaded
 * (the package offers it only from a barrel of every client plugin).
 */
export const authClient = createAuthClient({
  baseURL: typeof window !== "undefined" && window.location?.origin ? window.location.origin : "http://localhost:3000",
  basePath: "/api/auth",
  // Resolve fetch at call time, so the one network boundary can be swapped (tests, offline queue).
  fetchOptions: { customFetchImpl: (input, init) => globalThis.fetch(input, init) },
});
