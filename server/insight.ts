import { and, eq, gte, inArray, lt } from "drizzle-orm";
import { STUBBORN_MIN_ATTEMPTS, median, type FamilyRemedies, type InsightResponse, type StubbornCase } from "../knowledge/contracts/insight";
import type { Database } from "../db/client";
import { caseAttempts, cases, user } from "../db/schema";
import { remedyTitle } from "./advice";

/*
 * Group insight over the live cases (retired and merged-away ones left out) whose work-up falls
 * in the period. Everything is counted in one pass over the period's cases and attempts.
 */

const DAY_MS = 86_400_000;

export interface Period {
  from: string;
  to: string;
}

/** The last 12 calendar months up to `today` (UTC), or the given ends. */
export function insightPeriod(q: { from?: string; to?: string }, today = new Date()): Period {
  const to = q.to ?? today.toISOString().slice(0, 10);
  if (q.from) return { from: q.from, to };
  const end = new Date(`${to}T00:00:00Z`);
  const start = new Date(Date.UTC(end.getUTCFullYear(), end.getUTCMonth() - 11, 1));
  return { from: start.toISOString().slice(0, 10), to };
}

/** "2025-01", "2025-02"… from the month of `from` to the month of `to`. */
export function monthsBetween(from: string, to: string): string[] {
  const out: string[] = [];
  let y = Number(from.slice(0, 4));
  let m = Number(from.slice(5, 7));
  const endKey = to.slice(0, 7);
  for (;;) {
    const key = `${y}-${String(m).padStart(2, "0")}`;
    out.push(key);
    if (key >= endKey || out.length > 1200) break;
    m += 1;
    if (m > 12) {
      m = 1;
      y += 1;
    }
  }
  return out;
}

export async function groupInsight(db: Database, groupId: string, period: Period, now = new Date()): Promise<InsightResponse> {
  const start = new Date(`${period.from}T00:00:00Z`);
  const end = new Date(new Date(`${period.to}T00:00:00Z`).getTime() + DAY_MS);
  const rows = await db
    .select({
      id: cases.id,
      title: cases.title,
      status: cases.status,
      system: cases.system,
      solventFamily: cases.solventFamily,
      occurredAt: cases.occurredAt,
      authorName: user.name,
    })
    .from(cases)
    .innerJoin(user, eq(user.id, cases.authorId))
    .where(and(eq(cases.groupId, groupId), eq(cases.retired, false), gte(cases.occurredAt, start), lt(cases.occurredAt, end)));
  const ids = rows.map((r) => r.id);
  const attempts = ids.length
    ? await db
        .select({ caseId: caseAttempts.caseId, position: caseAttempts.position, remedyId: caseAttempts.remedyId, minutes: caseAttempts.minutes, outcome: caseAttempts.outcome })
        .from(caseAttempts)
        .where(and(eq(caseAttempts.groupId, groupId), inArray(caseAttempts.caseId, ids)))
    : [];
  const byCase = new Map<string, typeof attempts>();
  for (const a of attempts) byCase.set(a.caseId, [...(byCase.get(a.caseId) ?? []), a]);
  for (const list of byCase.values()) list.sort((x, y) => x.position - y.position);

  // Remedy success by the extraction solvent's family.
  const families = new Map<string, Map<string, { tried: number; cleared: number; partly: number }>>();
  for (const r of rows) {
    const family = r.solventFamily ?? "unknown";
    for (const a of byCase.get(r.id) ?? []) {
      if (!a.remedyId) continue;
      const remedies = families.get(family) ?? new Map();
      families.set(family, remedies);
      const c = remedies.get(a.remedyId) ?? { tried: 0, cleared: 0, partly: 0 };
      c.tried += 1;
      if (a.outcome === "cleared") c.cleared += 1;
      if (a.outcome === "partly") c.partly += 1;
      remedies.set(a.remedyId, c);
    }
  }
  const byFamily: FamilyRemedies[] = [...families.entries()]
    .map(([solventFamily, remedies]) => {
      const list = [...remedies.entries()]
        // The rate to 3 decimals: a screen shows it as a percentage to 1 decimal at most.
        .map(([remedyId, c]) => ({ remedyId, remedyTitle: remedyTitle(remedyId), ...c, rate: Math.round((c.cleared / c.tried) * 1000) / 1000 }))
        .sort((x, y) => y.tried - x.tried || y.rate - x.rate || x.remedyId.localeCompare(y.remedyId));
      return { solventFamily, tried: list.reduce((s, x) => s + x.tried, 0), remedies: list };
    })
    .sort((x, y) => y.tried - x.tried || x.solventFamily.localeCompare(y.solventFamily));

  // Time to clear: the minutes of every attempt up to and including the first that cleared.
  const clearTimes: number[] = [];
  let untimed = 0;
  const remedyTimes = new Map<string, number[]>();
  for (const r of rows) {
    const list = byCase.get(r.id) ?? [];
    const k = list.findIndex((a) => a.outcome === "cleared");
    if (k < 0) continue;
    const upTo = list.slice(0, k + 1);
    const clearing = list[k]!;
    if (clearing.remedyId && clearing.minutes !== null) {
      remedyTimes.set(clearing.remedyId, [...(remedyTimes.get(clearing.remedyId) ?? []), clearing.minutes]);
    }
    if (upTo.some((a) => a.minutes === null)) untimed += 1;
    else clearTimes.push(upTo.reduce((s, a) => s + (a.minutes ?? 0), 0));
  }

  const stubborn: StubbornCase[] = rows
    .filter((r) => {
      const list = byCase.get(r.id) ?? [];
      return r.status === "open" && list.length >= STUBBORN_MIN_ATTEMPTS && !list.some((a) => a.outcome === "cleared");
    })
    .map((r) => ({
      id: r.id,
      title: r.title,
      authorName: r.authorName,
      solvents: r.system.organic.map((o) => o.name),
      attempts: byCase.get(r.id)?.length ?? 0,
      openDays: Math.max(0, Math.floor((now.getTime() - r.occurredAt.getTime()) / DAY_MS)),
      occurredAt: r.occurredAt.toISOString(),
    }))
    .sort((x, y) => y.attempts - x.attempts || y.openDays - x.openDays)
    .slice(0, 20);

  // Each case counts each of its solvents once; a name the tables lack counts as typed.
  const solvents = new Map<string, { key: string | null; name: string; cases: number }>();
  for (const r of rows) {
    const seen = new Set<string>();
    for (const o of r.system.organic) {
      const id = o.key ?? `typed:${o.solvent.trim().toLowerCase()}`;
      if (seen.has(id)) continue;
      seen.add(id);
      const s = solvents.get(id) ?? { key: o.key, name: o.key ? o.name : o.solvent.trim(), cases: 0 };
      s.cases += 1;
      solvents.set(id, s);
    }
  }

  const months = new Map(monthsBetween(period.from, period.to).map((m) => [m, { month: m, cases: 0, resolved: 0 }]));
  for (const r of rows) {
    const m = months.get(r.occurredAt.toISOString().slice(0, 7));
    if (!m) continue;
    m.cases += 1;
    if (r.status === "resolved") m.resolved += 1;
  }

  const count = (status: string) => rows.filter((r) => r.status === status).length;
  return {
    period,
    totals: { cases: rows.length, open: count("open"), resolved: count("resolved"), abandoned: count("abandoned"), attempts: attempts.length },
    byFamily,
    timeToClear: {
      medianMinutes: median(clearTimes),
      cases: clearTimes.length,
      untimed,
      byRemedy: [...remedyTimes.entries()]
        .map(([remedyId, times]) => ({ remedyId, remedyTitle: remedyTitle(remedyId), medianMinutes: median(times)!, cases: times.length }))
        .sort((x, y) => y.cases - x.cases || x.medianMinutes - y.medianMinutes),
    },
    stubborn,
    solvents: [...solvents.values()].sort((x, y) => y.cases - x.cases || x.name.localeCompare(y.name)).slice(0, 12),
    perMonth: [...months.values()],
  };
}
