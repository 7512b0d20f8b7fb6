import type { PatientText } from '@/lib/wording';

/**
 * The small data table beside the icon arrays: each group with and without the outcome, in the
 * same natural frequencies as the sentences (lib/wording). Shared by the screen and the handout.
 */
export function GroupsTable({ text, className, testId }: { text: PatientText; className: string; testId?: string }) {
  return (
    <table className={className} data-testid={testId}>
      <caption>{text.dataTable.caption}</caption>
      <thead>
        <tr>
          <th scope="col">Group</th>
          <th scope="col">Will have {text.outcome}</th>
          <th scope="col">Will not</th>
        </tr>
      </thead>
      <tbody>
        {text.dataTable.rows.map((row) => (
          <tr key={row.group}>
            <th scope="row">{row.group}</th>
            <td>{row.willHave}</td>
            <td>{row.willNotHave}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
