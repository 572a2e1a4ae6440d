import * as z from "./zod";

/* Invitations to a lab group: request and response shapes shared by the server and the desk. */

export const INVITABLE_ROLES = ["owner", "lead", "chemist"] as const;
export type InvitableRole = (typeof INVITABLE_ROLES)[number];

export const createInvitationBody = z.object({
  email: z
    .string({ message: "Enter the e-mail address to invite." })
    .check(z.trim(), z.toLowerCase(), z.maxLength(254, "That address is too long."), z.email("Enter an e-mail address, e.g. name@example.org.")),
  role: z.enum(INVITABLE_ROLES, { message: "Pick a role: lead or chemist (an owner may also invite an owner)." }),
});
export type CreateInvitationBody = z.infer<typeof createInvitationBody>;

export type InvitationStatus = "pending" | "accepted" | "canceled" | "rejected";

export interface InvitationView {
  id: string;
  groupId: string;
  email: string;
  role: string;
  status: InvitationStatus | string;
  expiresAt: string;
  createdAt: string;
  invitedBy: { id: string; name: string } | null;
}

export interface CreatedInvitation extends InvitationView {
  /** false when the invitation was saved but the mail could not be sent (send it again) */
  mailed: boolean;
}

/** What the invite link's page shows before the invitee signs in. */
export interface InvitationPreview {
  id: string;
  groupName: string;
  inviterName: string;
  role: string;
  email: string;
  status: string;
  expiresAt: string;
  expired: boolean;
}

export interface AcceptedInvitation {
  groupId: string;
  groupName: string;
  role: string;
}
