/**
 * The printed page: everything a patient takes home, laid out for one sheet of A4 or US Letter.
 * It only renders the view model of lib/handout/sheet.ts (`handoutSheet`); nothing here
 * computes a number or builds a sentence. The numbers, the sentences and the caution are not
 * editable; the title, the opening words, the next steps and the clinic details come from the
 * editor through that view model.
 */
import { GroupsTable } from '@/app/components/GroupsTable';
import { IconArray } from '@/app/components/IconArray';
import { IconLegend } from '@/app/components/IconLegend';
import type { HandoutSheet as HandoutSheetView, SheetList } from '@/lib/handout';

export interface HandoutSheetProps {
  readonly sheet: HandoutSheetView;
  /**
   * Prefixes every id on the sheet, so several sheets can share one page (the checkups screen's
   * batch print); none on /handout.
   */
  readonly idPrefix?: string;
}

function ListSection({ id, list, ordered = false }: { id: string; list: SheetList; ordered?: boolean }) {
  const items = list.items.map((s) => <li key={s}>{s}</li>);
  return (
    <section aria-labelledby={id}>
      <h3 id={id} className="sheet__heading">
        {list.heading}
      </h3>
      {ordered ? <ol className="sheet__list">{items}</ol> : <ul className="sheet__list">{items}</ul>}
    </section>
  );
}

export function HandoutSheet({ sheet, idPrefix = '' }: HandoutSheetProps) {
  const { clinic, illustrative } = sheet;
  const id = (name: string) => `${idPrefix}${name}`;
  return (
    <article className={`sheet sheet--${sheet.layout}`} aria-labelledby={id('sheet-title')} data-testid="handout-sheet" data-layout={sheet.layout} data-audience={sheet.audience}>
      {illustrative ? (
        <div className="sheet__demo-band" role="note" aria-label={illustrative.heading} data-testid="handout-demo-band">
          <p className="sheet__demo-heading">{illustrative.heading}</p>
          <p className="sheet__demo-text">{illustrative.text}</p>
        </div>
      ) : null}
      <header className="sheet__header">
        <h2 id={id('sheet-title')} className="sheet__title">
          {sheet.title}
        </h2>
        {clinic ? (
          <p className="sheet__clinic">
            {clinic.name ? <span className="sheet__clinic-name">{clinic.name}</span> : null}
            {clinic.contact.length > 0 ? (
              <span className="sheet__clinic-contact" data-testid="handout-clinic-contact">
                {clinic.contact.map((segment, i) =>
                  segment.keepTogether ? (
                    <span key={i} className="sheet__nowrap">
                      {segment.text}
                    </span>
                  ) : (
                    segment.text
                  ),
                )}
              </span>
            ) : null}
          </p>
        ) : null}
      </header>

      <aside className="sheet__caution" aria-labelledby={id('sheet-caution')} data-testid="handout-caution">
        <h3 id={id('sheet-caution')} className="sheet__heading">
          {sheet.caution.heading}
        </h3>
        <p>{sheet.caution.text}</p>
      </aside>

      {sheet.opening.map((p, i) => (
        <p key={i} className="sheet__opening">
          {p}
        </p>
      ))}

      <section className={`sheet__numbers sheet__numbers--${sheet.denominator}`} aria-labelledby={id('sheet-numbers')}>
        <h3 id={id('sheet-numbers')} className="visually-hidden">
          {sheet.numbersHeading}
        </h3>
        <div className={`sheet__arrays sheet__arrays--${sheet.denominator}`}>
          {sheet.arrays.map((a) => (
            <IconArray key={a.key} layout={a.layout} title={a.title} description={a.caption} idPrefix={id(a.idPrefix)} />
          ))}
        </div>
        {sheet.listsBesidePictures ? (
          <div className="sheet__beside">
            <ListSection id={id('sheet-means')} list={sheet.means} />
            <ListSection id={id('sheet-not-mean')} list={sheet.doesNotMean} />
          </div>
        ) : null}
        <IconLegend entries={sheet.legend.entries} idPrefix={id('handout-legend')} heading={sheet.legend.heading} />
        <GroupsTable text={sheet.text} className="sheet__table" />
      </section>

      {sheet.ownResults ? (
        <section className="sheet__own" aria-labelledby={id('sheet-own')} data-testid="handout-own-results">
          <h3 id={id('sheet-own')} className="sheet__heading">
            {sheet.ownResults.heading}
          </h3>
          {sheet.ownResults.items.map((s) => (
            <p key={s}>{s}</p>
          ))}
        </section>
      ) : null}

      {sheet.listsBesidePictures ? null : (
        <div className="sheet__columns">
          <ListSection id={id('sheet-means')} list={sheet.means} />
          <ListSection id={id('sheet-not-mean')} list={sheet.doesNotMean} />
        </div>
      )}

      <div className="sheet__columns sheet__columns--wide">
        <section aria-labelledby={id('sheet-questions')}>
          <h3 id={id('sheet-questions')} className="sheet__heading">
            {sheet.questions.heading}
          </h3>
          <p>{sheet.questions.intro}</p>
          <ol className="sheet__list">
            {sheet.questions.items.map((q) => (
              <li key={q}>{q}</li>
            ))}
          </ol>
        </section>
        {sheet.nextSteps.paragraphs.length > 0 ? (
          <section aria-labelledby={id('sheet-next')}>
            <h3 id={id('sheet-next')} className="sheet__heading">
              {sheet.nextSteps.heading}
            </h3>
            {sheet.nextSteps.paragraphs.map((p, i) => (
              <p key={i}>{p}</p>
            ))}
          </section>
        ) : null}
      </div>

      <footer className="sheet__footer">
        <p suppressHydrationWarning>
          <span className="sheet__footer-label">{sheet.footer.label}</span>
          {sheet.footer.sources.join(' ')} {sheet.footer.preparedOn}
        </p>
      </footer>
    </article>
  );
}
