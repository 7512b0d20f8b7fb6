/**
 * `handoutSheet(scenario, template, options)`: one call, one complete printable sheet. Every
 * number, sentence, caption, key, source line, date, caution and reading grade the sheet (and
 * its editor) shows is here; app/components/handout only renders it. Pure and synchronous, with
 * no React or DOM, so a batch of sheets (one per worker) is a loop over this function.
 *
 * Refusals are data (`{ ok: false, issues }`):
 * - the engine's and the patient text's own issues, passed through;
 * - `certainty-reached`: the ratio times the baseline reaches certainty (the engine's
 *   `risk-ratio-exceeds-certainty` warning, at the estimate or the upper limit). The capped
 *   figures ("100 out of 100") must not reach a patient, so no sheet is made.
 *
 * What the sheet holds, top to bottom: the illustrative band (demo content only), the title and
 * clinic, the caution (at the top, so it is read first), the opening words, the pictures with
 * their sentences and one key, the person's own results (one person, when a glucose history was
 * handed over), what the numbers mean and do not mean, the questions and next steps, and where
 * the numbers come from with the date, written as the paper's region writes dates.
 */
import type { IconArrayLayout, IconKind } from '../engine/iconArray';
import type { GlucoseHistory } from '../glycaemia/parse';
import { MAX_GRADE, readability } from '../readability';
import { fail, ok, type Issue, type Result } from '../result';
import type { Scenario } from '../scenario/schema';
import type { PopulationTable } from '../tables/schema';
import { CAUTION_HEADING, OWN_RESULTS_HEADING, ownResultsText, patientProse, type LegendItem, type PatientText } from '../wording';
import { blockReadability, type HandoutBlockKey, type HandoutBlocks } from './blocks';
import { contactSegments, type ContactSegment } from './contact';
import { buildHandout, type HandoutAudience } from './content';
import { preparedOnLine } from './dates';
import { illustrativeBand, type IllustrativeBand } from './illustrative';
import { PAGE_MARGIN_MM, pageRule, PAPER_SIZES, type PaperSize } from './paper';
import type { Clinic } from './template';

/** How the pictures are laid out: beside their sentences, or large (at least 6 cm wide) for a class. */
export const HANDOUT_LAYOUTS = {
  standard: { label: 'Standard: pictures beside the words' },
  large: { label: 'Large pictures (at least 6 cm wide)' },
} as const;
export type HandoutLayout = keyof typeof HANDOUT_LAYOUTS;
export const HANDOUT_LAYOUT_KEYS = Object.keys(HANDOUT_LAYOUTS) as HandoutLayout[];
/** Narrowest printed picture in the large layout, in millimetres (a class reads it across a table). */
export const LARGE_PICTURE_MIN_WIDTH_MM = 60;

export const HANDOUT_AUDIENCES = {
  person: { label: 'One person (\u201Cpeople like you\u201D)' },
  group: { label: 'A group session (a class; no \u201Clike you\u201D)' },
} as const;
export const HANDOUT_AUDIENCE_KEYS = Object.keys(HANDOUT_AUDIENCES) as HandoutAudience[];

/** The engine warning that means the figures reached certainty and must not be shown to a patient. */
export const CERTAINTY_WARNING_CODE = 'risk-ratio-exceeds-certainty';

export interface HandoutSheetTemplate {
  readonly blocks: HandoutBlocks;
  readonly clinic: Clinic;
}

export interface HandoutSheetOptions {
  /** The day the handout is prepared. */
  readonly date: Date;
  readonly paper?: PaperSize | undefined;
  readonly layout?: HandoutLayout | undefined;
  readonly audience?: HandoutAudience | undefined;
  /** The population table the baseline was looked up in, when `scenario.tableId` names one. */
  readonly table?: PopulationTable | undefined;
  /** The person's glucose history (handed over from the consultation screen); one person only. */
  readonly history?: Pick<GlucoseHistory, 'criteria' | 'checkups'> | undefined;
  /**
   * Work out the reading grades the editor shows (default true). Nothing printed depends on them;
   * a batch of sheets that no one edits (the checkups screen's batch handouts) leaves them out:
   * they were more than half the time a sheet took. Without them `readability` is empty.
   */
  readonly grades?: boolean | undefined;
}

export interface SheetLegendEntry {
  readonly kind: IconKind;
  /** True for the "could be" swatch. */
  readonly uncertain?: boolean;
  readonly label: string;
}

export interface SheetArray {
  readonly key: 'reference' | 'exposed';
  readonly layout: IconArrayLayout;
  readonly title: string;
  /** The sentences beside the picture; also its text alternative. */
  readonly caption: string;
  readonly idPrefix: string;
}

export interface SheetList {
  readonly heading: string;
  readonly items: readonly string[];
}

export interface BlockGrade {
  readonly key: HandoutBlockKey;
  /** "Flesch–Kincaid grade 6.2 (aim for 8 or below); Flesch reading ease 75." or why there is none. */
  readonly line: string;
  readonly aboveTarget: boolean;
  /** Shown under an editor whose block is above the target. */
  readonly warning: string | undefined;
}

export interface HandoutSheet {
  readonly paper: {
    readonly key: PaperSize;
    readonly label: string;
    readonly pageRule: string;
    /** Height a printed page has for the sheet (paper less both margins), to check it fits. */
    readonly printableHeightMm: number;
    /** Said when the preview is taller than one page. */
    readonly overflowWarning: string;
    /**
     * Said before printing, whatever the preview measures, when the sheet is known not to fit one
     * page: the large layout with the person's own results. Printed from Chromium (2 December
     * 2026) it ran onto a second page on US Letter at 100 and 1,000 people and on A4 at 1,000,
     * and fit A4 at 100 with 2 mm to spare; the preview's measure missed it, because text set for
     * print wraps a little differently from the screen's in the narrow column beside the pictures.
     */
    readonly fitWarning: string | undefined;
  };
  readonly layout: HandoutLayout;
  /**
   * True when "what the numbers mean / do not mean" sit in the column beside the pictures
   * rather than under them: the large layout at 1,000 people, whose 6 cm wide pictures are
   * 12 cm tall, leaves room there and none below for a one-page sheet.
   */
  readonly listsBesidePictures: boolean;
  readonly audience: HandoutAudience;
  readonly illustrative: IllustrativeBand | undefined;
  readonly title: string;
  /** Said in the editor when the title is empty. */
  readonly titleWarning: string | undefined;
  readonly clinic: { readonly name: string | undefined; readonly contact: readonly ContactSegment[] } | undefined;
  readonly caution: { readonly heading: string; readonly text: string };
  readonly opening: readonly string[];
  /** Hidden heading of the pictures: who and when. */
  readonly numbersHeading: string;
  readonly denominator: number;
  readonly arrays: readonly [SheetArray, SheetArray];
  readonly legend: { readonly heading: string; readonly entries: readonly SheetLegendEntry[] };
  /** The patient text, for the groups table shown on screen (not printed). */
  readonly text: PatientText;
  readonly ownResults: SheetList | undefined;
  readonly means: SheetList;
  readonly doesNotMean: SheetList;
  readonly questions: SheetList & { readonly intro: string };
  readonly nextSteps: { readonly heading: string; readonly paragraphs: readonly string[] };
  readonly footer: { readonly label: string; readonly sources: readonly string[]; readonly preparedOn: string };
  readonly readability: {
    readonly blocks: readonly BlockGrade[];
    /** "Whole handout: Flesch–Kincaid grade 6.2." */
    readonly whole: string;
    readonly wholeGrade: number | undefined;
  };
  /** The engine's warnings, for the clinician (not printed). */
  readonly clinicianNotes: { readonly heading: string; readonly items: readonly string[] };
}

/** Splits a block into paragraphs at blank lines. */
export function paragraphs(text: string): string[] {
  return text
    .split(/\n\s*\n/)
    .map((p) => p.trim())
    .filter((p) => p.length > 0);
}

/** One key for both pictures: the exposed array's kinds cover the reference array's; "could be" last. */
export function sheetLegend(reference: readonly LegendItem[], exposed: readonly LegendItem[]): SheetLegendEntry[] {
  const seen = new Set<string>();
  const entries: SheetLegendEntry[] = [];
  for (const item of [...exposed, ...reference]) {
    if (seen.has(item.kind)) continue;
    seen.add(item.kind);
    entries.push(item.kind === 'uncertain' ? { kind: 'none', uncertain: true, label: item.label } : { kind: item.kind, label: item.label });
  }
  const order: IconKind[] = ['event', 'added', 'avoided', 'none'];
  return entries.sort((a, b) => Number(a.uncertain === true) - Number(b.uncertain === true) || order.indexOf(a.kind) - order.indexOf(b.kind));
}

/**
 * A reading grade with the formula named beside it.
 * @example
 * gradeLine({ grade: 6.24, readingEase: 74.6 }) //=> "Flesch–Kincaid grade 6.2 (aim for 8 or below); Flesch reading ease 75."
 */
export function gradeLine(score: { readonly grade: number; readonly readingEase: number }): string {
  return `Flesch\u2013Kincaid grade ${score.grade.toFixed(1)} (aim for ${MAX_GRADE} or below); Flesch reading ease ${score.readingEase.toFixed(0)}.`;
}

function blockGrades(blocks: HandoutBlocks): BlockGrade[] {
  return blockReadability(blocks).map((b) => ({
    key: b.key,
    line: b.score.ok ? gradeLine(b.score.value) : 'No words yet, so no reading grade.',
    aboveTarget: b.aboveTarget,
    warning: b.aboveTarget ? `Above grade ${MAX_GRADE}: try shorter sentences and everyday words.` : undefined,
  }));
}

function certaintyIssue(): Issue {
  return {
    code: 'certainty-reached',
    path: ['effect'],
    message:
      'The study\u2019s ratio times this baseline risk reaches certainty, so the figures would say that everyone in the group has the outcome. ' +
      'That cannot be right: a ratio this large does not carry over to a baseline this high. No handout is made. ' +
      'Use the clinician\u2019s figures and the warning on the consultation screen, and check the baseline and the study.',
  };
}

/**
 * One printable handout sheet.
 *
 * @example
 * handoutSheet(scenario, { blocks: DEFAULT_BLOCKS, clinic: {} }, { date: new Date(2025, 4, 12), paper: 'a4' })
 * //=> { ok: true, value: { caution: { heading: 'Please read: what these numbers are', … }, footer: { preparedOn: 'Prepared on 12 May 2025.', … }, … } }
 */
export function handoutSheet(scenario: Scenario, template: HandoutSheetTemplate, options: HandoutSheetOptions): Result<HandoutSheet> {
  const paper = options.paper ?? 'a4';
  const layout = options.layout ?? 'standard';
  const audience = options.audience ?? 'person';
  const content = buildHandout(scenario, { table: options.table, audience });
  if (!content.ok) return content;
  const { result, text } = content.value;
  if (result.warnings.some((w) => w.code === CERTAINTY_WARNING_CODE)) return fail([certaintyIssue()]);

  const { blocks, clinic } = template;
  const own = audience === 'person' && options.history ? (ownResultsText(options.history)?.sentences ?? []) : [];
  const clinicName = clinic.name?.trim() || undefined;
  const clinicContact = clinic.contact?.trim() ?? '';
  const size = PAPER_SIZES[paper];

  const opening = paragraphs(blocks.opening);
  const nextSteps = paragraphs(blocks.nextSteps);
  const grades = options.grades !== false;
  const whole = grades ? readability([blocks.title, ...opening, patientProse(text), ...own, ...nextSteps].join('\n')) : undefined;
  const wholeGrade = whole?.ok ? whole.value.grade : undefined;

  return ok({
    paper: {
      key: paper,
      label: size.label,
      pageRule: pageRule(paper),
      printableHeightMm: size.heightMm - 2 * PAGE_MARGIN_MM,
      overflowWarning: `The handout may run onto a second ${size.label} page: shorten the opening words or the next steps.`,
      fitWarning:
        layout === 'large' && own.length > 0
          ? `With the person\u2019s own results, the large layout may run onto a second ${size.label} page: for one page, choose the standard layout or leave their results off.`
          : undefined,
    },
    layout,
    listsBesidePictures: layout === 'large' && text.denominator === 1000,
    audience,
    illustrative: illustrativeBand(scenario, options.table),
    title: blocks.title,
    titleWarning: blocks.title.trim().length === 0 ? 'The title is empty: the page prints without one.' : undefined,
    clinic: clinicName || clinicContact ? { name: clinicName, contact: contactSegments(clinicContact) } : undefined,
    caution: { heading: CAUTION_HEADING, text: text.caution },
    opening,
    numbersHeading: text.groupLine,
    denominator: text.denominator,
    arrays: [
      { key: 'reference', layout: text.reference.layout, title: text.reference.title, caption: text.reference.caption, idPrefix: 'handout-reference' },
      { key: 'exposed', layout: text.exposed.layout, title: text.exposed.title, caption: text.exposed.caption, idPrefix: 'handout-exposed' },
    ],
    legend: { heading: 'Key to the pictures', entries: sheetLegend(text.reference.legend, text.exposed.legend) },
    text,
    ownResults: own.length > 0 ? { heading: OWN_RESULTS_HEADING, items: own } : undefined,
    means: { heading: 'What the numbers mean', items: text.means },
    doesNotMean: { heading: 'What they do not mean', items: text.doesNotMean },
    questions: {
      heading: audience === 'group' ? 'Questions to talk about' : 'Questions for your visit',
      intro: text.teachBackIntro,
      items: text.teachBack,
    },
    nextSteps: { heading: 'Next steps', paragraphs: nextSteps },
    footer: { label: 'Where the numbers come from: ', sources: content.value.sources, preparedOn: preparedOnLine(options.date, paper) },
    readability: {
      blocks: grades ? blockGrades(blocks) : [],
      whole:
        wholeGrade === undefined
          ? ''
          : `Whole handout: Flesch\u2013Kincaid grade ${wholeGrade.toFixed(1)}${wholeGrade > MAX_GRADE ? `, above ${MAX_GRADE}` : ''}.`,
      wholeGrade,
    },
    clinicianNotes: { heading: 'Notes for the clinician (not printed)', items: result.warnings.map((w) => w.message) },
  });
}
