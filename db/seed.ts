import { count, eq } from "drizzle-orm";
import type { Auth } from "../server/auth";
import type { Database } from "./client";
import { member, organization, user } from "./schema";
import { seedCases } from "./seed-cases";
import { seedPlans } from "./seed-plans";

/** The demo group: a fictional process-chemistry group and its three accounts. */
export const DEMO_GROUP = { name: "Larchmere Process Group", slug: "larchmere-process" };
export const DEMO_ACCOUNTS = [
  { role: "owner", name: "Ines Varga", email: "owner@larchmere.example", password: "larchmere-owner-1" },
  { role: "lead", name: "Tomas Reyne", email: "lead@larchmere.example", password: "larchmere-lead-1" },
  { role: "chemist", name: "Kit Ambrose", email: "chemist@larchmere.example", password: "larchmere-chemist-1" },
] as const;

export interface SeedHook {
  (args: { db: Database; groupId: string; users: Record<"owner" | "lead" | "chemist", string> }): Promise<void>;
}

/** Extra demo content added by each area (cases, plans…), run once after the accounts exist. */
export const DEMO_HOOKS: SeedHook[] = [seedCases, seedPlans];

export async function isEmpty(db: Database): Promise<boolean> {
  const rows = await db.select({ n: count() }).from(user);
  return Number(rows[0]?.n ?? 0) === 0;
}

export async function seedDemo(db: Database, auth: Auth): Promise<void> {
  const ids: Record<string, string> = {};
  for (const account of DEMO_ACCOUNTS) {
    const created = await auth.api.signUpEmail({
      body: { name: account.name, email: account.email, password: account.password },
    });
    ids[account.role] = created.user.id;
  }
  const groupId = crypto.randomUUID();
  await db.transaction(async (tx) => {
    await tx.insert(organization).values({ id: groupId, name: DEMO_GROUP.name, slug: DEMO_GROUP.slug, createdAt: new Date() });
    for (const account of DEMO_ACCOUNTS) {
      await tx.insert(member).values({
        id: crypto.randomUUID(),
        organizationId: groupId,
        userId: ids[account.role]!,
        role: account.role,
        createdAt: new Date(),
      });
    }
  });
  const users = { owner: ids.owner!, lead: ids.lead!, chemist: ids.chemist! };
  for (const hook of DEMO_HOOKS) await hook({ db, groupId, users });
}

export async function demoGroupId(db: Database): Promise<string | undefined> {
  const rows = await db.select({ id: organization.id }).from(organization).where(eq(organization.slug, DEMO_GROUP.slug));
  return rows[0]?.id;
}
