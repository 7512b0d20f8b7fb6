/**
 * Who "people like you" are, in words: the group every patient sentence is about.
 *
 * Always state who the figures describe (Trevena et al. 2013, BMC Med Inform Decis Mak
 * 13(Suppl 2):S7). The phrase is built from what the baseline was
 * looked up for, never from identifiers:
 * - sex → "women" / "men" (under 18: "girls" / "boys"); unknown or "any" → "people";
 * - the table's age band → "aged 50 to 59" ("aged 80 and over" for an open top band;
 *   nothing for a band spanning every age, lib/text/ages.ts); without a band, the person's
 *   age → "aged 53";
 * - with neither sex nor age, a short population text the clinician wrote (e.g. "adults at a
 *   workplace health check") is used as it stands;
 * - with none of these there is no honest description, and the function refuses.
 * The sentence adds "like you" after the phrase: "women aged 50 to 59 like you".
 */
import { fail, ok, type Result } from '../result';
import type { Person } from '../scenario/schema';
import { agedPhrase, formatCount, phraseText, type AgeBand } from '../text';

export type { AgeBand };

export interface PeopleInput {
  readonly person?: Person | undefined;
  /** The band the baseline was looked up in; preferred to the exact age. */
  readonly ageBand?: AgeBand | undefined;
  /** Used only when neither sex nor age is known. Trimmed; at most 80 characters. */
  readonly population?: string | undefined;
}

/** Longest population text accepted as the group phrase: it goes inside every sentence. */
export const MAX_PEOPLE_PHRASE = 80;

function noun(sex: Person['sex'], age: number | undefined): string {
  const child = age !== undefined && age < 18;
  if (sex === 'female') return child ? 'girls' : 'women';
  if (sex === 'male') return child ? 'boys' : 'men';
  return 'people';
}

function agePart(input: PeopleInput): string | undefined {
  const band = input.ageBand;
  // A band that spans every age says nothing about age (never "aged 0 and over").
  if (band) return agedPhrase(band);
  const age = input.person?.age;
  return age === undefined ? undefined : `aged ${formatCount(age)}`;
}

/**
 * The plural phrase naming the group, without "like you".
 *
 * @example
 * describePeople({ person: { age: 53, sex: 'female' }, ageBand: { fromYears: 50, toYears: 59 } })
 * //=> { ok: true, value: "women aged 50 to 59" }
 * describePeople({})
 * //=> { ok: false, issues: [{ code: 'population-required', path: ['people'], … }] }
 */
export function describePeople(input: PeopleInput): Result<string> {
  const sex = input.person?.sex;
  const age = agePart(input);
  if (sex !== undefined || age !== undefined) {
    const ageYears = input.ageBand?.toYears ?? input.person?.age;
    return ok([noun(sex, ageYears), age].filter((part) => part !== undefined).join(' '));
  }
  const population = phraseText(input.population);
  if (population.length === 0) {
    return fail([
      {
        code: 'population-required',
        path: ['people'],
        message:
          'Say who the figures are about: give the person\u2019s age or sex (as the table uses them) or a short description of the group, e.g. "adults at a workplace health check"',
      },
    ]);
  }
  if (population.length > MAX_PEOPLE_PHRASE) {
    return fail([
      {
        code: 'too-long',
        path: ['people'],
        message: `The description of the group must be at most ${MAX_PEOPLE_PHRASE} characters: it goes inside every sentence`,
      },
    ]);
  }
  return ok(population);
}
