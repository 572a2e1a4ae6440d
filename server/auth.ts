import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { organization } from "better-auth/plugins";
import type { Database } from "../db/client";
import * as schema from "../db/schema";
import type { Mailer } from "./mail";
import { invitationMail, resetPasswordMail } from "./mail-messages";
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

/** How long an invitation link stays valid. */
export const INVITATION_DAYS = 7;

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
      resetPasswordTokenExpiresIn: 60 * 60,
      // The link opens the app's reset screen with the token; the screen posts it to /api/auth/reset-password.
      sendResetPassword: async ({ user, token }) => {
        await mail.send(resetPasswordMail({ to: user.email, link: `${options.baseURL}/reset-password?token=${encodeURIComponent(token)}` }));
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
        invitationExpiresIn: INVITATION_DAYS * 24 * 60 * 60,
        // A second invitation to the same address replaces the first, so one link is ever live.
        cancelPendingInvitationsOnReInvite: true,
        sendInvitationEmail: async (data) => {
          await mail.send(
            invitationMail({
              to: data.email,
              groupName: data.organization.name,
              inviterName: data.inviter.user.name,
              role: data.role,
              link: `${options.baseURL}/invite/${data.id}`,
              expiresAt: new Date(data.invitation.expiresAt),
            }),
          );
        },
      }),
    ],
  });
}

export type Auth = ReturnType<typeof createAuth>;
