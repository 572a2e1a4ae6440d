import { useCallback, useState } from "react";
import { readDraft, writeDraft } from "./use-draft";

/*
 * The last layer checks a person ran, kept on this device (localStorage on the web, through the
 * draft store) so the usual systems are one tap away. Newest first, one entry per system.
 */

export interface RecentCheck {
  /** the check's query string, e.g. "o=dichloromethane%3A40&aq=water&av=20&t=20" */
  query: string;
  /** "DCM 40 mL · water 20 mL" */
  label: string;
  /** "organic on the bottom" */
  answer: string;
  /** ISO time it was last run */
  at: string;
}

export const MAX_RECENT_CHECKS = 8;

const storageKey = (owner: string) => `layers.recent.${owner}`;

export function readRecentChecks(owner: string): RecentCheck[] {
  const stored = readDraft<RecentCheck[]>(storageKey(owner))?.data;
  return Array.isArray(stored) ? stored.filter((c) => typeof c?.query === "string" && typeof c?.label === "string") : [];
}

/** Put a check first (moving it if it is there already) and keep the newest MAX_RECENT_CHECKS. */
export function addRecentCheck(list: RecentCheck[], check: RecentCheck): RecentCheck[] {
  return [check, ...list.filter((c) => c.query !== check.query)].slice(0, MAX_RECENT_CHECKS);
}

/** `owner` keeps one person's checks apart from another's on a shared device. */
export function useRecentChecks(owner: string) {
  const [state, setState] = useState(() => ({ owner, checks: readRecentChecks(owner) }));
  const checks = state.owner === owner ? state.checks : readRecentChecks(owner);
  if (state.owner !== owner) setState({ owner, checks });

  // Written to storage at once (not inside a state update), so it also works while the screen closes.
  const remember = useCallback(
    (check: Omit<RecentCheck, "at">) => {
      const current = readRecentChecks(owner);
      if (current[0]?.query === check.query) return;
      const next = addRecentCheck(current, { ...check, at: new Date().toISOString() });
      writeDraft(storageKey(owner), next);
      setState({ owner, checks: next });
    },
    [owner],
  );

  const forget = useCallback(() => {
    writeDraft(storageKey(owner), []);
    setState({ owner, checks: [] });
  }, [owner]);

  return { checks, remember, forget };
}
