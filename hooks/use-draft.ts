import { useCallback, useState } from "react";

/*
 * Local drafts for forms filled at the hood: every change is written through at once, so a
 * phone that locks or a connection that drops mid-form loses nothing. The draft goes only when
 * the caller clears it after a successful save. On the web it lives in localStorage; where
 * that is missing (native without a storage module, private modes that throw) it falls back
 * to memory for the life of the app.
 */

interface DraftStorage {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

const PREFIX = "phasewise.draft.";
const VERSION = 1;

interface Envelope<T> {
  v: number;
  savedAt: string;
  data: T;
}

function memoryStorage(): DraftStorage {
  const m = new Map<string, string>();
  return {
    getItem: (k) => m.get(k) ?? null,
    setItem: (k, v) => void m.set(k, v),
    removeItem: (k) => void m.delete(k),
  };
}

const memory = memoryStorage();

function storage(): DraftStorage {
  try {
    const ls = (globalThis as { localStorage?: DraftStorage }).localStorage;
    if (ls) {
      // Safari private mode and full quotas throw on write: probe once per call site.
      ls.setItem(`${PREFIX}probe`, "1");
      ls.removeItem(`${PREFIX}probe`);
      return ls;
    }
  } catch {
    /* fall through to memory */
  }
  return memory;
}

export interface StoredDraft<T> {
  data: T;
  savedAt: Date;
}

export function readDraft<T>(key: string): StoredDraft<T> | null {
  try {
    const raw = storage().getItem(PREFIX + key);
    if (!raw) return null;
    const env = JSON.parse(raw) as Envelope<T>;
    if (env?.v !== VERSION || env.data === undefined) return null;
    return { data: env.data, savedAt: new Date(env.savedAt) };
  } catch {
    return null;
  }
}

export function writeDraft<T>(key: string, data: T, now = new Date()): void {
  const env: Envelope<T> = { v: VERSION, savedAt: now.toISOString(), data };
  try {
    storage().setItem(PREFIX + key, JSON.stringify(env));
  } catch {
    memory.setItem(PREFIX + key, JSON.stringify(env));
  }
}

export function removeDraft(key: string): void {
  try {
    storage().removeItem(PREFIX + key);
  } catch {
    /* nothing stored */
  }
  memory.removeItem(PREFIX + key);
}

export interface Draft<T> {
  value: T;
  /** replace or update the value; written to storage at once */
  set: (next: T | ((prev: T) => T)) => void;
  /** forget the draft (after a save) and go back to the initial value */
  clear: () => void;
  /** when the value shown came from an earlier session, its save time; otherwise null */
  restoredAt: Date | null;
}

/**
 * A piece of form state that outlives the screen. `initial` is used when no draft is stored
 * under `key`; pass a key that includes the user (and the record, for per-record forms).
 */
export function useDraft<T>(key: string, initial: T | (() => T)): Draft<T> {
  const init = useCallback(() => (typeof initial === "function" ? (initial as () => T)() : initial), [initial]);
  const [state, setState] = useState<{ key: string; value: T; restoredAt: Date | null }>(() => {
    const stored = readDraft<T>(key);
    return stored ? { key, value: stored.data, restoredAt: stored.savedAt } : { key, value: init(), restoredAt: null };
  });

  // A new key (another user or record) reads its own draft.
  let current = state;
  if (state.key !== key) {
    const stored = readDraft<T>(key);
    current = stored ? { key, value: stored.data, restoredAt: stored.savedAt } : { key, value: init(), restoredAt: null };
    setState(current);
  }

  const set = useCallback(
    (next: T | ((prev: T) => T)) => {
      setState((s) => {
        const value = typeof next === "function" ? (next as (prev: T) => T)(s.value) : next;
        writeDraft(s.key, value);
        return { ...s, value };
      });
    },
    [],
  );

  const clear = useCallback(() => {
    removeDraft(key);
    setState({ key, value: init(), restoredAt: null });
  }, [key, init]);

  return { value: current.value, set, clear, restoredAt: current.restoredAt };
}
