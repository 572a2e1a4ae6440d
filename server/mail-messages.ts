import type { OutgoingMail } from "./mail";

/*
 * Every message Phasewise sends, in one place: plain text first (it reads well on a phone at the
 * hood), with a small HTML part whose links are the same as the text's.
 */

function escapeHtml(s: string): string {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}

/** Paragraphs of text; a paragraph that is only an address becomes a link in the HTML part. */
function compose(to: string, subject: string, paragraphs: string[]): OutgoingMail {
  const text = paragraphs.join("\n\n");
  const html = paragraphs
    .map((p) => (/^https?:\/\/\S+$/.test(p) ? `<p><a href="${escapeHtml(p)}">${escapeHtml(p)}</a></p>` : `<p>${escapeHtml(p).replace(/\n/g, "<br>")}</p>`))
    .join("\n");
  return { to, subject, text, html };
}

export const ROLE_WORDS: Record<string, string> = {
  owner: "an owner (manages members and roles)",
  lead: "a lead (curates the group's cases and reference data)",
  chemist: "a chemist (logs and reads the group's work-ups)",
};

export function invitationMail(input: {
  to: string;
  groupName: string;
  inviterName: string;
  role: string;
  link: string;
  expiresAt: Date;
}): OutgoingMail {
  return compose(input.to, `You are invited to ${input.groupName} on Phasewise`, [
    `${input.inviterName} invites you to join ${input.groupName} on Phasewise as ${ROLE_WORDS[input.role] ?? input.role}.`,
    "Open this link to accept. You can create an account there with this e-mail address, or sign in if you have one:",
    input.link,
    `The invitation is valid until ${input.expiresAt.toUTCString()}. If you were not expecting it, ignore this message.`,
  ]);
}

export function resetPasswordMail(input: { to: string; link: string }): OutgoingMail {
  return compose(input.to, "Reset your Phasewise password", [
    `Someone asked to reset the Phasewise password for ${input.to}.`,
    "Open this link to choose a new one (valid for one hour):",
    input.link,
    "If it was not you, ignore this message: your password stays as it is.",
  ]);
}

export function attemptMail(input: {
  to: string;
  caseTitle: string;
  authorName: string;
  remedy: string;
  outcome: string;
  link: string;
}): OutgoingMail {
  return compose(input.to, `New attempt on “${input.caseTitle}”`, [
    `${input.authorName} logged an attempt on a case you follow: ${input.remedy} — ${input.outcome}.`,
    "See the case:",
    input.link,
    "You get these because you follow the case; unfollow it on the case page to stop them.",
  ]);
}

export interface DigestLine {
  title: string;
  detail: string;
  link: string;
}

export function digestMail(input: {
  to: string;
  groupName: string;
  stubborn: DigestLine[];
  verified: DigestLine[];
  deskLink: string;
  sinceLabel: string;
}): OutgoingMail {
  const list = (lines: DigestLine[], empty: string) =>
    lines.length ? lines.map((l) => `• ${l.title} — ${l.detail}\n  ${l.link}`).join("\n") : empty;
  const text = [
    `The week in ${input.groupName} (since ${input.sinceLabel}).`,
    `Stubborn open cases (${input.stubborn.length}): open more than 3 days or 3 or more failed attempts.\n${list(input.stubborn, "None — nothing is stuck.")}`,
    `Newly verified fixes (${input.verified.length}):\n${list(input.verified, "None this week.")}`,
    `The lead's desk: ${input.deskLink}`,
  ];
  return {
    to: input.to,
    subject: `Phasewise weekly: ${input.stubborn.length} stubborn, ${input.verified.length} newly verified — ${input.groupName}`,
    text: text.join("\n\n"),
    html: text.map((p) => `<p>${escapeHtml(p).replace(/\n/g, "<br>")}</p>`).join("\n"),
  };
}
