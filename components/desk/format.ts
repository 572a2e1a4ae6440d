/* Small formatting helpers for the desk. */

/** "2025-03-14 09:05" in the viewer's time zone. */
export function formatWhen(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

export function formatDay(iso: string): string {
  return formatWhen(iso).slice(0, 10);
}

const ACTION_WORDS: Record<string, string> = {
  "override.create": "Corrected a reference value",
  "override.replace": "Replaced a reference correction",
  "override.retire": "Retired a reference correction",
  "invitation.create": "Invited",
  "invitation.resend": "Invited again",
  "invitation.revoke": "Revoked an invitation",
  "invitation.accept": "Accepted an invitation",
  restore: "Restored a version",
};

/** A readable phrase for an audit action; other areas' verbs read as themselves ("verify" → "Verify"). */
export function actionLabel(action: string): string {
  const known = ACTION_WORDS[action];
  if (known) return known;
  const words = action.replace(/[._-]+/g, " ").trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

const ENTITY_WORDS: Record<string, string> = {
  "reference-override": "Reference correction",
  invitation: "Invitation",
};

/** A readable name for an audit entry's kind of record. */
export function entityLabel(entityType: string): string {
  return ENTITY_WORDS[entityType] ?? actionLabel(entityType);
}

/**
 * What the entry is about, in words: "dichloromethane · densityGPerMl20C" becomes the
 * solvent's name and the value's label for a correction; an invitation shows its address.
 */
export function recordLabel(entry: { entityType: string; entityId: string; before: unknown; after: unknown }, names: (key: string) => string | undefined): string {
  const snap = (entry.after ?? entry.before) as { email?: string } | null;
  if (entry.entityType === "invitation" && snap?.email) return snap.email;
  if (entry.entityType === "reference-override") {
    const [kind, key = "", detail = ""] = entry.entityId.split(":");
    const name = names(key) ?? key;
    return kind === "aqueous-point" ? `${name} · ${detail} % w/w` : `${name} · ${names(detail) ?? detail}`;
  }
  return entry.entityId;
}

/** A number with as many decimals as its field shows. */
export function formatValue(value: number | null, decimals: number, unit: string): string {
  if (value === null) return "none";
  return `${value.toFixed(decimals)} ${unit}`;
}

export interface Change {
  /** dotted path, e.g. "payload.value" */
  path: string;
  before: string;
  after: string;
}

function flatten(value: unknown, prefix: string, out: Map<string, string>, depth: number): void {
  if (value !== null && typeof value === "object" && !Array.isArray(value) && depth < 3) {
    for (const [k, v] of Object.entries(value)) flatten(v, prefix ? `${prefix}.${k}` : k, out, depth + 1);
    return;
  }
  if (prefix) out.set(prefix, value === null || value === undefined ? "—" : typeof value === "string" ? value : JSON.stringify(value));
}

/** What an audit entry changed: the fields whose value differs between before and after. */
export function changesBetween(before: unknown, after: unknown): Change[] {
  const b = new Map<string, string>();
  const a = new Map<string, string>();
  flatten(before, "", b, 0);
  flatten(after, "", a, 0);
  const paths = [...new Set([...b.keys(), ...a.keys()])].sort();
  return paths
    .map((path) => ({ path, before: b.get(path) ?? "—", after: a.get(path) ?? "—" }))
    .filter((c) => c.before !== c.after);
}
