import Fuse from "fuse.js";
import { SHIPPED_REFERENCE, allowedTypos, editDistance, findSolute, findSolvent } from "../knowledge/reference";
import type { ReferenceData } from "../knowledge/types";

/*
 * The case-log search box. PostgreSQL full text ('simple' configuration, a stored tsvector with a
 * GIN index) finds and ranks; typing slips are absorbed before the query is built, by matching
 * each word against the group's own vocabulary (fuse.js proposes, edit distance decides). Solvent
 * and aqueous names are resolved through the reference tables, so "DCM", "methylene chloride"
 * and "dichloromethane" all find a case logged with any of them. Terms combine with AND.
 *
 * Measured before choosing (synthetic notes of ~100 words): fuse.js over whole case texts took
 * 0.2–0.4 s per query at 1k cases and 1.3–3.8 s at 20k; trigram word-similarity 0.3–14 s at 20k
 * (and pg_trgm needs an extension loaded into PGlite); full text with a GIN index 1–60 ms at 20k
 * on PGlite and PostgreSQL alike. Through the route at 20k cases, warm: 0.2–0.5 s on PGlite and
 * 0.09–0.3 s on PostgreSQL for queries matching 10–80 % of the cases (ranking them is most of it).
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
      const solvent = findSolvent(phrase, ref);
      const solute = solvent ? undefined : findSolute(phrase, ref);
      const concept = solvent ? `solvent:${solvent.key}` : solute ? `aqueous:${solute.key}` : undefined;
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

/** The distinct words of a group's cases, for typo correction. */
export class SearchVocabulary {
  private readonly fuse: Fuse<string>;
  private readonly words: Set<string>;

  constructor(words: Iterable<string>) {
    this.words = new Set(words);
    this.fuse = new Fuse([...this.words], { includeScore: true, threshold: 0.4, ignoreLocation: true });
  }

  static fromTexts(texts: string[]): SearchVocabulary {
    const words = new Set<string>();
    for (const t of texts) for (const w of searchWords(t)) words.add(w);
    return new SearchVocabulary(words);
  }

  get size(): number {
    return this.words.size;
  }

  /** Words of the vocabulary within the typo allowance of `word` (never `word` itself). */
  corrections(word: string, limit = 8): string[] {
    const allowed = allowedTypos(word.length);
    if (allowed === 0) return [];
    return this.fuse
      .search(word, { limit: 40 })
      .map((r) => r.item)
      .filter((w) => w !== word && editDistance(word, w) <= allowed)
      .slice(0, limit);
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
      const options = [`${w}:*`, ...vocab.corrections(w)];
      return options.length === 1 ? options[0]! : `(${options.join(" | ")})`;
    })
    .join(joiner);
  const [kind, key] = term.concept?.split(":") ?? [];
  const entry = kind === "solvent" ? ref.solvents.find((s) => s.key === key) : kind === "aqueous" ? ref.solutes.find((s) => s.key === key) : undefined;
  if (!entry) return typed;
  const named = searchWords(entry.name).join(" <-> ");
  return named === typed ? typed : `(${typed}) | (${named})`;
}

/**
 * One vocabulary per group, rebuilt when the group's cases change (the version is the count and
 * the latest update). Process-local: a second server process simply builds its own.
 */
export class VocabularyCache {
  private readonly entries = new Map<string, { version: string; vocab: SearchVocabulary }>();

  constructor(private readonly maxGroups = 50) {}

  async get(groupId: string, version: string, load: () => Promise<string[]>): Promise<SearchVocabulary> {
    const hit = this.entries.get(groupId);
    if (hit && hit.version === version) return hit.vocab;
    const vocab = SearchVocabulary.fromTexts(await load());
    this.entries.delete(groupId);
    this.entries.set(groupId, { version, vocab });
    while (this.entries.size > this.maxGroups) this.entries.delete(this.entries.keys().next().value!);
    return vocab;
  }
}
