/**
 * Finding evidence entries by words: every word typed must begin a word of the entry (its
 * title, wording, notes, measure, design or exposure definition), ignoring case and accents.
 * "hba1c heart" finds an entry about HbA1c and heart failure; "art" does not find "heart".
 */
import type { EvidenceEntry } from './schema';

/** Lower-case words without accents: "HbA1c, risk-set" → ["hba1c", "risk", "set"]. */
export function searchWords(text: string): string[] {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter((w) => w.length > 0);
}

function entryText(entry: EvidenceEntry): { title: string[]; rest: string[] } {
  const { wording, effect, exposureDefinition, notes } = entry;
  const rest = [
    wording.outcome,
    wording.exposure,
    wording.comparison,
    wording.population,
    wording.citation,
    notes,
    effect.measure,
    effect.design,
    exposureDefinition ? `${exposureDefinition.category} ${exposureDefinition.criteria}` : undefined,
    entry.id,
  ];
  return { title: searchWords(entry.title), rest: searchWords(rest.filter((t) => t !== undefined).join(' ')) };
}

/**
 * The entries matching every word of `query`, best first: more words found in the title
 * first, then the library's order. An empty query gives every entry in order.
 *
 * @example
 * searchEvidence(DEMO_EVIDENCE, 'heart failure').map((e) => e.id) //=> ['demo-workforce-hba1c-heart-failure']
 */
export function searchEvidence(entries: readonly EvidenceEntry[], query: string): EvidenceEntry[] {
  const words = [...new Set(searchWords(query))];
  if (words.length === 0) return [...entries];
  const scored: { entry: EvidenceEntry; score: number; index: number }[] = [];
  entries.forEach((entry, index) => {
    const { title, rest } = entryText(entry);
    let score = 0;
    for (const word of words) {
      const inTitle = title.some((w) => w.startsWith(word));
      if (!inTitle && !rest.some((w) => w.startsWith(word))) return;
      if (inTitle) score++;
    }
    scored.push({ entry, score, index });
  });
  scored.sort((a, b) => b.score - a.score || a.index - b.index);
  return scored.map((s) => s.entry);
}
