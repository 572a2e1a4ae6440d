// Used only by the better-auth CLI to generate db/auth-schema.ts.
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import { accessControl, authRoles } from "../server/roles";

export const auth = betterAuth({
  database: drizzleAdapter({} as never, { provider: "pg" }),
  emailAndPassword: { enabled: true },
  plugins: [organization({ ac: accessControl, roles: authRoles })],
});
