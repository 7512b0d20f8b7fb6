import type { PopulationTable } from '@/lib/tables/schema';
import { tablePreview } from './tablePreview';

/** What the table gives for this person: the stratum's risk or rate, the horizon and the source. */
export function LookupSummary({ table, person }: { table: PopulationTable; person: { age: string; sex: string } }) {
  const preview = tablePreview(table, person);
  return (
    <div className="lookup" aria-live="polite" data-testid="lookup">
      {preview.ok ? (
        <p className="lookup__figure">
          <strong>{preview.group}:</strong> {preview.figure}
        </p>
      ) : (
        <p className="lookup__pending">{preview.message}</p>
      )}
      <p className="lookup__source">
        {table.population}. Source: {table.source} ({table.year}).
      </p>
      {table.illustrative ? <p className="badge badge--illustrative">Illustrative numbers, not from a real population</p> : null}
    </div>
  );
}

export default LookupSummary;
