/**
 * What the person in the chair sees: the two icon arrays with one denominator, each with its
 * sentence, key and a small table of what it draws (adding up to the denominator, the range in
 * its own row); then the two groups side by side in words. Rendered from the view model
 * (lib/consultation/view.ts); nothing is computed here.
 */
import { memo } from 'react';
import { GroupsTable } from '@/app/components/GroupsTable';
import { IconArray } from '@/app/components/IconArray';
import { IconLegend } from '@/app/components/IconLegend';
import type { PatientPanelView, PictureView } from '@/lib/consultation';

function ArrayBlock({ picture, idPrefix }: { picture: PictureView; idPrefix: string }) {
  return (
    <div className="array-block" data-testid={`array-${picture.key}`}>
      <IconArray layout={picture.layout} title={picture.title} description={picture.description} idPrefix={idPrefix} />
      <IconLegend entries={picture.keyEntries} idPrefix={`${idPrefix}-legend`} heading="Key" />
      <table className="data-table data-table--compact">
        <caption>{picture.tableCaption}</caption>
        <thead>
          <tr>
            <th scope="col">Icon</th>
            <th scope="col">People</th>
          </tr>
        </thead>
        <tbody>
          {picture.rows.map((row) => (
            <tr key={row.kind} className={row.kind === 'total' ? 'data-table__total' : undefined}>
              <th scope="row">{row.label}</th>
              <td data-testid={`count-${picture.key}-${row.kind}`}>{row.count}</td>
            </tr>
          ))}
        </tbody>
        {picture.rangeRow ? (
          <tbody className="data-table__range">
            <tr>
              <th scope="row">{picture.rangeRow.label}</th>
              <td data-testid={`count-${picture.key}-range`}>{picture.rangeRow.count}</td>
            </tr>
          </tbody>
        ) : null}
      </table>
    </div>
  );
}

function PatientViewInner({ view }: { view: PatientPanelView }) {
  const [reference, exposed] = view.pictures;
  return (
    <section className="patient" aria-labelledby="patient-heading" data-testid="patient">
      <h3 id="patient-heading">{view.heading}</h3>
      <div className="arrays">
        <ArrayBlock picture={reference} idPrefix="array-reference" />
        <ArrayBlock picture={exposed} idPrefix="array-exposed" />
      </div>
      <GroupsTable text={view.groupsTable} className="data-table" testId="groups-table" />
      {view.sentencesReady ? (
        <div className="meaning">
          <div>
            <h4>What these numbers mean</h4>
            <ul>
              {view.means.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </div>
          <div>
            <h4>What they do not mean</h4>
            <ul>
              {view.doesNotMean.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          </div>
        </div>
      ) : null}
    </section>
  );
}

export const PatientView = memo(PatientViewInner);
