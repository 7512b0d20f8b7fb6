/**
 * What the person in the chair sees: the two icon arrays with one denominator, each with its
 * sentence, key and a small table of what it draws; then the two groups side by side in words.
 * Every string comes from lib/wording/patient.ts; every count from the engine.
 */
import { memo } from 'react';
import { IconArray } from '@/app/components/IconArray';
import { IconLegend, legendEntriesFrom } from '@/app/components/IconLegend';
import type { ArrayText, PatientText } from '@/lib/wording/patient';
import { formatCount } from '@/lib/wording/format';
import { GroupsTable } from '@/app/components/GroupsTable';

function ArrayBlock({ text, idPrefix }: { text: ArrayText; idPrefix: string }) {
  return (
    <div className="array-block" data-testid={`array-${text.key}`}>
      <IconArray layout={text.layout} title={text.title} description={text.alt} idPrefix={idPrefix} />
      <IconLegend entries={legendEntriesFrom(text.legend)} idPrefix={`${idPrefix}-legend`} heading="Key" />
      <table className="data-table data-table--compact">
        <caption>What the picture shows, out of {formatCount(text.layout.denominator)}</caption>
        <thead>
          <tr>
            <th scope="col">Icon</th>
            <th scope="col">People</th>
          </tr>
        </thead>
        <tbody>
          {text.legend.map((item) => (
            <tr key={item.kind}>
              <th scope="row">{item.label}</th>
              <td data-testid={`count-${text.key}-${item.kind}`}>{formatCount(item.count)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function PatientViewInner({ text }: { text: PatientText }) {
  return (
    <section className="patient" aria-labelledby="patient-heading">
      <h3 id="patient-heading">For the person: out of {formatCount(text.denominator)} people like you</h3>
      <div className="arrays">
        <ArrayBlock text={text.reference} idPrefix="array-reference" />
        <ArrayBlock text={text.exposed} idPrefix="array-exposed" />
      </div>
      <GroupsTable text={text} className="data-table" testId="groups-table" />
      <div className="meaning">
        <div>
          <h4>What these numbers mean</h4>
          <ul>
            {text.means.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </div>
        <div>
          <h4>What they do not mean</h4>
          <ul>
            {text.doesNotMean.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </div>
      </div>
    </section>
  );
}

export const PatientView = memo(PatientViewInner);
