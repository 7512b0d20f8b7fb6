/**
 * The handout's editable text blocks — title, opening words, next steps — with defaults in
 * plain language (each at or below Flesch–Kincaid grade 8, tested). Everything else on the
 * handout (the numbers, the sentences built from them, the caution) comes from lib/wording
 * and is not editable.
 */
import { z } from '../zod';
import { readability, MAX_GRADE, type Readability } from '../readability';
import type { Result } from '../result';

/** Longest title, in characters: one line at the top of the page. */
export const MAX_TITLE_CHARS = 120;
/** Longest opening words or next steps, in characters: a short paragraph, so the page stays one sheet. */
export const MAX_BLOCK_CHARS = 400;

export const HANDOUT_BLOCK_KEYS = ['title', 'opening', 'nextSteps'] as const;
export type HandoutBlockKey = (typeof HANDOUT_BLOCK_KEYS)[number];

/** What each block is called in the editor and in messages. */
export const BLOCK_LABELS: Readonly<Record<HandoutBlockKey, string>> = {
  title: 'Title',
  opening: 'Opening words',
  nextSteps: 'Next steps',
};

function blockText(what: string, max: number) {
  return z
    .string({ error: (iss) => (iss.input === undefined ? `${what} is required (it may be empty text "")` : `${what} must be text`) })
    .max(max, { error: `${what} must be at most ${max} characters` });
}

export const handoutBlocksSchema = z.strictObject({
  title: blockText('The title', MAX_TITLE_CHARS).refine((t) => t.trim().length > 0, { error: 'The title must not be empty' }),
  opening: blockText('The opening words', MAX_BLOCK_CHARS),
  nextSteps: blockText('The next steps', MAX_BLOCK_CHARS),
});

export type HandoutBlocks = z.infer<typeof handoutBlocksSchema>;

/** The defaults: short sentences, common words. */
export const DEFAULT_BLOCKS: HandoutBlocks = {
  title: 'What your numbers mean',
  opening: 'This sheet is for you to take home. It shows the numbers we talked about today. The pictures show the same numbers as the words.',
  nextSteps: 'Write down any questions you have. Bring this sheet to your next visit. If you are worried, call us. We can go over it again.',
};

export interface BlockReadability {
  readonly key: HandoutBlockKey;
  /** Scores, or an issue when the block has no words to score. */
  readonly score: Result<Readability>;
  /** True when the block scores above {@link MAX_GRADE}: the editor warns. */
  readonly aboveTarget: boolean;
}

/**
 * The grade and reading ease of each editable block, for the editor's live display.
 * @example
 * blockReadability(DEFAULT_BLOCKS).map((b) => b.aboveTarget) //=> [false, false, false]
 */
export function blockReadability(blocks: HandoutBlocks): BlockReadability[] {
  return HANDOUT_BLOCK_KEYS.map((key) => {
    const score = readability(blocks[key]);
    return { key, score, aboveTarget: score.ok && score.value.grade > MAX_GRADE };
  });
}
