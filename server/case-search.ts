import { sql, type SQL } from "drizzle-orm";
import type { Database } from "../db/client";
import { SHIPPED_REFERENCE, allowedTypos, findSolute, findSolvent } from "../knowledge/reference";
import type { ReferenceData } from "../knowledge/types";

/*
 * The case-log search box. PostgreSQL full text ('simple' configuration, a stored tsvector with a
 * GIN index) finds and ranks; typing slips are absorbed before the query is built, by matching
 * each unknown word against the group's own vocabulary (length and letter-set buckets propose,
 * edit distance decides). Solvent and aqueous names are resolved through the reference tables,
 * so "DCM", "methylene chloride" and "dichloromethane" all find a case logged with any of them.
 * Terms combine with AND.
 *
 * Measured before choosing (synthetic notes of ~100 words): fuse.js over whole case texts took
 * 0.2–0.4 s per query at 1k cases and 1.3–3.8 s at 20k; trigram word-similarity 0.3–14 s at 20k
 * (and pg_trgm needs an extension loaded into PGlite); full text with a GIN index 1–60 ms at 20k
 * on PGlite and PostgreSQL alike. Fuse.js as the typo proposer cost ~30 ms per query word over a
 * 20k-word vocabulary (0.12 s over 120k words); the length and letter-set buckets below find every
 * word within the allowance in 0.02–0.4 ms over the same 120k.
 */

/** Lower case, accents dropped, split into the words PostgreSQL's 'simple' parser would index. */
export function searchWords(text: string): string[] {
  return text
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter((w) => w !== "");
}

export interface SearchTerm {
  /** the words as typed, lower case */
  text: string;
  /** "solvent:<key>" or "aqueous:<key>" when the words name a reference entry */
  concept?: string;
}

const MAX_NGRAM = 4;

const MEMO_LIMIT = 5_000;
const concepts = new WeakMap<ReferenceData, Map<string, string | undefined>>();

/** The reference entry a phrase names, remembered: the fuzzy name lookups were most of parsing a query. */
function conceptOf(phrase: string, ref: ReferenceData): string | undefined {
  let memo = concepts.get(ref);
  if (!memo) concepts.set(ref, (memo = new Map()));
  if (memo.has(phrase)) return memo.get(phrase);
  const solvent = findSolvent(phrase, ref);
  const solute = solvent ? undefined : findSolute(phrase, ref);
  const concept = solvent ? `solvent:${solvent.key}` : solute ? `aqueous:${solute.key}` : undefined;
  if (memo.size >= MEMO_LIMIT) memo.clear();
  memo.set(phrase, concept);
  return concept;
}

/**
 * Splits the query into terms; runs of up to four words that name a solvent or an aqueous solute
 * become one concept term ("methylene chloride", "sat. NaHCO3"), longest first.
 */
export function parseSearchQuery(q: string, ref: ReferenceData = SHIPPED_REFERENCE): SearchTerm[] {
  const words = q
    .toLowerCase()
    .split(/[\s,;]+/)
    .map((w) => w.replace(/^["'(]+|["')]+$/g, ""))
    .filter((w) => searchWords(w).length > 0);
  const terms: SearchTerm[] = [];
  let i = 0;
  while (i < words.length) {
    let taken = 0;
    for (let n = Math.min(MAX_NGRAM, words.length - i); n >= 1 && taken === 0; n--) {
      const phrase = words.slice(i, i + n).join(" ");
      // Two letters are too ambiguous to stand for a reference entry on their own ("ea", "me").
      if (searchWords(phrase).join("").length < 3) continue;
      const concept = conceptOf(phrase, ref);
      if (concept) {
        terms.push({ text: phrase, concept });
        taken = n;
      }
    }
    if (taken === 0) {
      terms.push({ text: words[i]! });
      taken = 1;
    }
    i += taken;
  }
  return terms;
}

/** The letters a–z present (bits 0–25), and the digits (bits 0–9): one edit changes at most two bits of the pair. */
function charMasks(word: string): [letters: number, digits: number] {
  let letters = 0;
  let digits = 0;
  for (let i = 0; i < word.length; i++) {
    const c = word.charCodeAt(i);
    if (c >= 97) letters |= 1 << (c - 97);
    else digits |= 1 << (c - 48);
  }
  return [letters, digits];
}

function bitCount(x: number): number {
  let v = x - ((x >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
}

let rows: Int32Array[] = [new Int32Array(64), new Int32Array(64), new Int32Array(64)];

/**
 * Whether the optimal-string-alignment distance (knowledge/reference's editDistance) of a and b
 * is at most k, and what it is when it is; stops as soon as a row of the table passes k.
 */
function distanceWithin(a: string, b: string, k: number): number | null {
  if (Math.abs(a.length - b.length) > k) return null;
  if (rows[0]!.length <= b.length) rows = rows.map(() => new Int32Array(b.length + 1));
  let [before, prev, cur] = rows as [Int32Array, Int32Array, Int32Array];
  for (let j = 0; j <= b.length; j++) prev[j] = j;
  for (let i = 1; i <= a.length; i++) {
    cur[0] = i;
    let best = i;
    for (let j = 1; j <= b.length; j++) {
      const cost = a.charCodeAt(i - 1) === b.charCodeAt(j - 1) ? 0 : 1;
      let v = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, before[j - 2]! + 1);
      cur[j] = v;
      if (v < best) best = v;
    }
    if (best > k) return null;
    [before, prev, cur] = [prev, cur, before];
  }
  return prev[b.length]! <= k ? prev[b.length]! : null;
}

/**
 * The distinct words of a group's cases, for typo correction. Words only ever join: a word whose
 * last case changed stays as a harmless extra alternative until the process restarts.
 */
export class SearchVocabulary {
  private readonly words = new Set<string>();
  /** the same words in code-unit order, for "is this the start of a known word" */
  private readonly sorted: string[] = [];
  /** by length, with letter and digit masks alongside, so a lookup only visits plausible candidates */
  private readonly byLength: { words: string[]; letters: number[]; digits: number[] }[] = [];

  constructor(words: Iterable<string> = []) {
    this.add(words);
  }

  get size(): number {
    return this.words.size;
  }

  /** Adds words of [a-z0-9] (others could not reach a tsquery); answers how many were new. */
  add(words: Iterable<string>): number {
    const fresh: string[] = [];
    for (const w of words) {
      if (this.words.has(w) || !/^[a-z0-9]+$/.test(w)) continue;
      this.words.add(w);
      fresh.push(w);
      const bucket = (this.byLength[w.length] ??= { words: [], letters: [], digits: [] });
      const [letters, digits] = charMasks(w);
      bucket.words.push(w);
      bucket.letters.push(letters);
      bucket.digits.push(digits);
    }
    if (fresh.length > 64) {
      for (const w of fresh) this.sorted.push(w);
      this.sorted.sort();
    } else for (const w of fresh) this.sorted.splice(this.lowerBound(w), 0, w);
    return fresh.length;
  }

  private lowerBound(word: string): number {
    let lo = 0;
    let hi = this.sorted.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (this.sorted[mid]! < word) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }

  /** The word, or a word it begins: the prefix query finds it as typed. */
  knows(word: string): boolean {
    return this.words.has(word) || (this.sorted[this.lowerBound(word)]?.startsWith(word) ?? false);
  }

  /**
   * Words of the vocabulary within the typo allowance of `word` (never `word` itself), closest
   * first. Only words of a near length whose letter sets differ by at most two letters per
   * allowed slip can be that close, so edit distance runs on those alone.
   */
  corrections(word: string, limit = 8): string[] {
    const allowed = allowedTypos(word.length);
    if (allowed === 0) return [];
    const [letters, digits] = charMasks(word);
    const found: { w: string; d: number }[] = [];
    for (let len = Math.max(1, word.length - allowed); len <= word.length + allowed; len++) {
      const bucket = this.byLength[len];
      if (!bucket) continue;
      for (let i = 0; i < bucket.words.length; i++) {
        if (bitCount(bucket.letters[i]! ^ letters) + bitCount(bucket.digits[i]! ^ digits) > 2 * allowed) continue;
        const w = bucket.words[i]!;
        const d = w === word ? null : distanceWithin(word, w, allowed);
        if (d !== null) found.push({ w, d });
      }
    }
    return found
      .sort((x, y) => x.d - y.d || Math.abs(x.w.length - word.length) - Math.abs(y.w.length - word.length) || (x.w < y.w ? -1 : 1))
      .slice(0, limit)
      .map((x) => x.w);
  }
}

/**
 * One term as a tsquery: every word must match (as a prefix, so "emul" finds "emulsion"), each
 * word also by its close spellings in the vocabulary. A term that names a reference entry also
 * matches by the entry's own name, which every case using it carries in its search text (so a
 * misspelt "dichlormethane" still finds them); one tsquery per term keeps the GIN index usable.
 * Only [a-z0-9] reach the query text, so the string is always valid tsquery syntax.
 */
export function termTsQuery(term: SearchTerm, vocab: SearchVocabulary, ref: ReferenceData = SHIPPED_REFERENCE): string {
  // The words of a named entry must stand together ("sodium <-> chloride"), or "methylene chloride"
  // plus "sodium bicarbonate" elsewhere in a case would pass for sodium chloride.
  const joiner = term.concept ? " <-> " : " & ";
  const typed = searchWords(term.text)
    .map((w) => {
      // A known word (or the start of one) is taken as meant; only unknown words get alternatives.
      const options = [`${w}:*`, ...(vocab.knows(w) ? [] : vocab.corrections(w))];
      return options.length === 1 ? options[0]! : `(${options.join(" | ")})`;
    })
    .join(joiner);
  const [kind, key] = term.concept?.split(":") ?? [];
  const entry = kind === "solvent" ? ref.solvents.find((s) => s.key === key) : kind === "aqueous" ? ref.solutes.find((s) => s.key === key) : undefined;
  if (!entry) return typed;
  const named = searchWords(entry.name).join(" <-> ");
  // The entry's own name first: most cases that match carry it, and | stops at the first match.
  return named === typed ? typed : `(${named}) | (${typed})`;
}

type Row = Record<string, unknown>;
const rowsOf = (result: unknown) => (result as { rows: Row[] }).rows;

/**
 * The distinct indexed words of the vectors `vectors` (query text, from SQL's format()) selects,
 * [a-z0-9] only (nothing else reaches a tsquery). ts_stat counts them inside PostgreSQL: at 20k
 * cases 0.14 s, against 0.8 s for unnest and distinct.
 */
async function wordsOf(db: Database, vectors: SQL): Promise<string[]> {
  const [row] = rowsOf(await db.execute(sql`select array(select word from ts_stat(${vectors}) where word ~ '^[a-z0-9]+$') as words`));
  return (row?.words as string[] | null) ?? [];
}

const currentSnapshot = sql`pg_current_snapshot()::text`;

interface CachedVocabulary {
  vocab: SearchVocabulary;
  /** pg_current_snapshot() when the vocabulary last caught up: every case visible in it is in */
  snapshot: string;
}

/** Past this many changed cases a catch-up reads the group whole: one pass beats that many lookups (an import, a bulk load). */
const REREAD_ABOVE = 2_000;

/**
 * One vocabulary per group, read once and then kept up to date: each search asks the database
 * which of the group's cases were written by transactions its last snapshot did not see (the
 * stamps the triggers keep, see db/schema/case-search.ts) and adds their words. The question is
 * an index range read, and it notices writes from any server process on the same database.
 *
 * With `analyze` (PGlite, which runs no autovacuum) it also refreshes the planner's statistics
 * of the tables a search reads once the cases it has seen change pass autovacuum's default
 * threshold (50 + 10 %). Without them the planner takes a group for a sliver of the table and
 * tests every case's vector in turn instead of walking the date index: 0.1 s at 20k cases.
 */
export class VocabularyCache {
  private readonly entries = new Map<string, CachedVocabulary>();
  private readonly loading = new Map<string, Promise<CachedVocabulary>>();
  /** reads of a whole group's words (the first search of a group in this process, or after a bulk change) */
  fullReads = 0;
  /** the table's row count as of its last ANALYZE (-1: never), read on first use */
  private analyzedRows: number | null = null;
  private changedSinceAnalyze = 0;
  private analyzing: Promise<void> | null = null;

  constructor(
    private readonly db: Database,
    private readonly options: { analyze?: boolean; maxGroups?: number } = {},
  ) {}

  async get(groupId: string): Promise<SearchVocabulary> {
    const hit = this.entries.get(groupId);
    const vocab = hit ? await this.catchUp(groupId, hit) : (await this.readGroup(groupId)).vocab;
    await this.maybeAnalyze();
    return vocab;
  }

  private async catchUp(groupId: string, hit: CachedVocabulary): Promise<SearchVocabulary> {
    // The cases written by transactions the last snapshot did not see (committed since, or then in progress).
    const xmin = hit.snapshot.split(":")[0]!;
    const [row] = rowsOf(
      await this.db.execute(
        sql`select ${currentSnapshot} as snapshot, (select count(*) from case_search_stamps s where s.group_id = ${groupId}
          and s.xact >= ${xmin}::bigint and not pg_visible_in_snapshot(s.xact::text::xid8, ${hit.snapshot}::pg_snapshot))::int as n`,
      ),
    );
    const n = Number(row?.n ?? 0);
    this.changedSinceAnalyze += n;
    if (n > REREAD_ABOVE) return (await this.readGroup(groupId)).vocab;
    if (n > 0) {
      // The same cases, as query text for ts_stat.
      const vectors = `select c.search_vector from cases c where c.group_id = %1$L and c.id in (select s.case_id from case_search_stamps s
        where s.group_id = %1$L and s.xact >= %2$L::bigint and not pg_visible_in_snapshot(s.xact::text::xid8, %3$L::pg_snapshot))`;
      hit.vocab.add(await wordsOf(this.db, sql`format(${vectors}, ${groupId}::text, ${xmin}::text, ${hit.snapshot}::text)`));
    }
    // A later snapshot only once its words are in; an older one (a slower concurrent search) just re-reads a little.
    hit.snapshot = String(row?.snapshot);
    this.entries.delete(groupId);
    this.entries.set(groupId, hit);
    return hit.vocab;
  }

  private readGroup(groupId: string): Promise<CachedVocabulary> {
    const pending = this.loading.get(groupId);
    if (pending) return pending;
    const read = (async () => {
      this.fullReads += 1;
      // The snapshot first: whatever a later write adds, the next catch-up reads.
      const [row] = rowsOf(await this.db.execute(sql`select ${currentSnapshot} as snapshot, (select count(*) from cases where group_id = ${groupId})::int as n`));
      const vocab = new SearchVocabulary(await wordsOf(this.db, sql`format('select search_vector from cases where group_id = %L', ${groupId}::text)`));
      const entry = { vocab, snapshot: String(row?.snapshot) };
      this.entries.delete(groupId);
      this.entries.set(groupId, entry);
      while (this.entries.size > (this.options.maxGroups ?? 50)) this.entries.delete(this.entries.keys().next().value!);
      // A group larger than the whole table was at its last ANALYZE has grown since.
      if (this.options.analyze) this.changedSinceAnalyze = Math.max(this.changedSinceAnalyze, Number(row?.n ?? 0) - Math.max(0, await this.rowsAtAnalyze()));
      return entry;
    })().finally(() => this.loading.delete(groupId));
    this.loading.set(groupId, read);
    return read;
  }

  private async rowsAtAnalyze(): Promise<number> {
    if (this.analyzedRows === null) {
      const [row] = rowsOf(await this.db.execute(sql`select reltuples from pg_class where oid = 'cases'::regclass`));
      this.analyzedRows = Number(row?.reltuples ?? -1);
    }
    return this.analyzedRows;
  }

  private async maybeAnalyze(): Promise<void> {
    if (!this.options.analyze || this.changedSinceAnalyze === 0) return;
    if (this.analyzing) return this.analyzing;
    if (this.changedSinceAnalyze <= 50 + 0.1 * Math.max(0, await this.rowsAtAnalyze())) return;
    this.analyzing = (async () => {
      this.changedSinceAnalyze = 0;
      await this.db.execute(sql`analyze cases, case_attempts, case_photos, case_followers, case_search_stamps`);
      this.analyzedRows = null;
    })().finally(() => (this.analyzing = null));
    return this.analyzing;
  }
}
