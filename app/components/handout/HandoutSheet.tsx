/**
 * The printed page: everything a patient takes home, laid out for one sheet of A4 or US Letter.
 * It only lays out what lib/handout and lib/wording made; nothing here computes a number.
 * The numbers, the sentences and the caution are not editable; the title, the opening words,
 * the next steps and the clinic details come from the editor.
 */
import { IconArray } from '@/app/components/IconArray';
import { IconLegend, type IconLegendEntry } from '@/app/components/IconLegend';
import type { Clinic, HandoutBlocks, HandoutContent } from '@/lib/handout';
import type { LegendItem } from '@/lib/wording';
import { CAUTION_HEADING } from '@/lib/wording';
import { GroupsTable } from '@/app/components/GroupsTable';

export interface HandoutSheetProps {
  readonly content: HandoutContent;
  readonly blocks: HandoutBlocks;
  readonly clinic: Clinic;
}

/** One key for both pictures: the exposed array's kinds cover the reference array's. */
function legendEntries(reference: readonly LegendItem[], exposed: readonly LegendItem[]): IconLegendEntry[] {
  const seen = new Set<string>();
  const entries: IconLegendEntry[] = [];
  for (const item of [...exposed, ...reference]) {
    if (seen.has(item.kind)) continue;
    seen.add(item.kind);
    entries.push(item.kind === 'uncertain' ? { kind: 'none', uncertain: true, label: item.label } : { kind: item.kind, label: item.label });
  }
  const order = ['event', 'added', 'avoided', 'none'];
  return entries.sort((a, b) => Number(a.uncertain === true) - Number(b.uncertain === true) || order.indexOf(a.kind) - order.indexOf(b.kind));
}

function Paragraphs({ text, className }: { text: string; className?: string }) {
  const parts = text.split(/\n\s*\n/).map((p) => p.trim()).filter((p) => p.length > 0);
  return (
    <>
      {parts.map((p, i) => (
        <p key={i} className={className}>
          {p}
        </p>
      ))}
    </>
  );
}

export function HandoutSheet({ content, blocks, clinic }: HandoutSheetProps) {
  const { text } = content;
  const clinicName = clinic.name?.trim();
  const clinicContact = clinic.contact?.trim();
  return (
    <article className="sheet" aria-labelledby="sheet-title" data-testid="handout-sheet">
      <header className="sheet__header">
        <h2 id="sheet-title" className="sheet__title">
          {blocks.title}
        </h2>
        {clinicName || clinicContact ? (
          <p className="sheet__clinic">
            {clinicName ? <span className="sheet__clinic-name">{clinicName}</span> : null}
            {clinicContact ? <span className="sheet__clinic-contact">{clinicContact}</span> : null}
          </p>
        ) : null}
      </header>
      {blocks.opening.trim() ? <Paragraphs text={blocks.opening} className="sheet__opening" /> : null}

      <section className="sheet__numbers" aria-labelledby="sheet-numbers">
        <h3 id="sheet-numbers" className="visually-hidden">
          {text.groupLine}
        </h3>
        <div className={`sheet__arrays sheet__arrays--${text.denominator}`}>
          <IconArray layout={text.reference.layout} title={text.reference.title} description={text.reference.caption} idPrefix="handout-reference" />
          <IconArray layout={text.exposed.layout} title={text.exposed.title} description={text.exposed.caption} idPrefix="handout-exposed" />
        </div>
        <IconLegend entries={legendEntries(text.reference.legend, text.exposed.legend)} idPrefix="handout-legend" heading="Key to the pictures" />
        <GroupsTable text={text} className="sheet__table" />
      </section>

      <div className="sheet__columns">
        <section aria-labelledby="sheet-means">
          <h3 id="sheet-means" className="sheet__heading">
            What the numbers mean
          </h3>
          <ul className="sheet__list">
            {text.means.map((s) => (
              <li key={s}>{s}</li>
            ))}
          </ul>
        </section>
        <section aria-labelledby="sheet-not-mean">
          <h3 id="sheet-not-mean" className="sheet__heading">
            What they do not mean
          </h3>
          <ul className="sheet__list">
            {text.doesNotMean.map((s) => (
              <li key={s}>{s}</li>
            ))}
          </ul>
        </section>
      </div>

      <aside className="sheet__caution" aria-labelledby="sheet-caution" data-testid="handout-caution">
        <h3 id="sheet-caution" className="sheet__heading">
          {CAUTION_HEADING}
        </h3>
        <p>{text.caution}</p>
      </aside>

      <div className="sheet__columns sheet__columns--wide">
        <section aria-labelledby="sheet-questions">
          <h3 id="sheet-questions" className="sheet__heading">
            Questions for your visit
          </h3>
          <p>{text.teachBackIntro}</p>
          <ol className="sheet__list">
            {text.teachBack.map((q) => (
              <li key={q}>{q}</li>
            ))}
          </ol>
        </section>
        {blocks.nextSteps.trim() ? (
          <section aria-labelledby="sheet-next">
            <h3 id="sheet-next" className="sheet__heading">
              Next steps
            </h3>
            <Paragraphs text={blocks.nextSteps} />
          </section>
        ) : null}
      </div>

      <footer className="sheet__footer">
        <p suppressHydrationWarning>
          <span className="sheet__footer-label">Where the numbers come from: </span>
          {content.sources.join(' ')} {content.preparedOn}
        </p>
      </footer>
    </article>
  );
}
