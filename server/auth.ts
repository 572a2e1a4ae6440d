import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import type { Database } from "../db/client";
import * as schema from "../db/schema";
import type { Mailer } from "./mail";
import { accessControl, authRoles } from "./roles";

export interface AuthOptions {
  db: Database;
  mail: Mailer;
  baseURL: string;
  secret: string;
  trustedOrigins: string[];
  /** Test runs turn the sign-in rate limit down or off deliberately. */
  rateLimit?: { enabled: boolean; window?: number; max?: number };
  /** Tests keep the auth logger to errors only. */
  quiet?: boolean;
}

export function createAuth(options: AuthOptions) {
  const { db, mail } = options;
  return betterAuth({
    appName: "Phasewise",
    logger: { level: options.quiet ? "error" : "warn" },
    baseURL: options.baseURL,
    basePath: "/api/auth",
    secret: options.secret,
    trustedOrigins: options.trustedOrigins,
    database: drizzleAdapter(db, { provider: "pg", schema }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: 8,
      sendResetPassword: async ({ user, url }) => {
        await mail.send({
          to: user.email,
          subject: "Reset your Phasewise password",
          text: `Someone asked to reset the Phasewise password for ${user.email}.\n\nOpen this link to choose a new one (valid for one hour):\n${url}\n\nIf it was not you, ignore this message.`,
        });
      },
    },
    rateLimit: {
      enabled: options.rateLimit?.enabled ?? true,
      window: options.rateLimit?.window ?? 60,
      max: options.rateLimit?.max ?? 100,
      customRules: { "/sign-in/email": { window: 60, max: 10 } },
    },
    advanced: {
      database: { generateId: () => crypto.randomUUID() },
      ipAddress: { ipAddressHeaders: ["x-phasewise-client-ip"] },
      // better-auth turns its origin (CSRF) check off when NODE_ENV=test; keep it on so tests see production.
      disableOriginCheck: false,
    },
    plugins: [
      organization({
        ac: accessControl,
        roles: authRoles,
        creatorRole: "owner",
        allowUserToCreateOrganization: true,
        sendInvitationEmail: async (data) => {
          const link = `${options.baseURL}/invite/${data.id}`;
          await mail.send({
            to: data.email,
            subject: `You are invited to ${data.organization.name} on Phasewise`,
            text: `${data.inviter.user.name} invites you to join ${data.organization.name} as ${data.role}.\n\nAccept here: ${link}`,
          });
        },
      }),
    ],
  });
}

export type Auth = ReturnType<typeof createAuth>;
