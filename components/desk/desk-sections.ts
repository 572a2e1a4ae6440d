import type { ComponentType } from "react";
import type { GroupRole, MyGroup } from "../../hooks/use-me";
import { AdviceSection } from "./advice-section";
import { AuditSection } from "./audit-section";
import { BackupSection } from "./backup-section";
import { DigestSection } from "./digest-section";
import { InsightSection } from "./insight-section";
import { PeopleSection } from "./people-section";
import { ReferenceSection } from "./reference-section";
import { ReviewSection } from "./review-section";

/** What every desk section receives. */
export interface DeskSectionProps {
  group: MyGroup & { userId: string };
  /** the caller's role reaches `actsFrom`; otherwise the section shows read-only (the server refuses anyway) */
  canAct: boolean;
}

export interface DeskSection {
  /** the URL segment: /desk/<key> */
  key: string;
  label: string;
  /** one line under the tabs: what the section is for */
  summary: string;
  /** the weakest role whose actions the section offers */
  actsFrom: GroupRole;
  component: ComponentType<DeskSectionProps>;
}

/** The lead's desk, one entry per tab, in tab order. Add a section with one entry here. */
export const DESK_SECTIONS: DeskSection[] = [
  { key: "people", label: "People", summary: "Members and their roles; invite by e-mail, revoke pending invitations.", actsFrom: "lead", component: PeopleSection },
  {
    key: "reference",
    label: "Reference",
    summary: "The group's corrections to solvent and solution values, each with its source and reason, beside the shipped value.",
    actsFrom: "lead",
    component: ReferenceSection,
  },
  { key: "audit", label: "Audit log", summary: "Every curation action: who, when, before and after; bring back an earlier version.", actsFrom: "lead", component: AuditSection },
  { key: "digest", label: "Digest", summary: "The weekly mail to leads: stubborn open cases and newly verified fixes.", actsFrom: "lead", component: DigestSection },
  { key: "review", label: "Review", summary: "New and newly resolved cases: verify, ask the author for more, merge duplicates, retire.", actsFrom: "lead", component: ReviewSection },
  { key: "advice", label: "Advice", summary: "The group's notes on remedies, each resting on verified cases; shown in the emulsion help.", actsFrom: "lead", component: AdviceSection },
  { key: "insight", label: "Insight", summary: "What clears emulsions here, how long it takes, stubborn cases and solvents used, by period.", actsFrom: "chemist", component: InsightSection },
  { key: "backup", label: "Backup", summary: "The whole group as one file, cases as CSV, and a backup brought into an empty group.", actsFrom: "lead", component: BackupSection },
];

export function deskSection(key: string | undefined): DeskSection {
  return DESK_SECTIONS.find((s) => s.key === key) ?? DESK_SECTIONS[0]!;
}
