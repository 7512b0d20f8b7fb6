import type { PatientText } from '@/lib/wording';

/**
 * The small data table beside the icon arrays: each group with and without the outcome, in the
 * same natural frequencies as the sentences. Every string comes from lib/wording/patient.ts.
 * Shared by the screen and the handout.
 */
export function GroupsTable({ text, className, testId }: { text: Pick<PatientText, 'dataTable'>; className: string; testId?: string }) {
  const { caption, headers, rows } = text.dataTable;
  return (
    <table className={className} data-testid={testId}>
      <caption>{caption}</caption>
      <thead>
        <tr>
          <th scope="col">{headers.group}</th>
          <th scope="col">{headers.willHave}</th>
          <th scope="col">{headers.willNotHave}</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
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
