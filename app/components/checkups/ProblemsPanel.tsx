/** Row problems: where (row and column) and why, and how many; from lib/checkups only. */
import { problemLine, problemsHeading } from '@/lib/checkups/summaryView';
import type { RowProblem } from '@/lib/workforce';

const SHOWN = 200;

export function ProblemsPanel({ problems, skippedRows }: { problems: readonly RowProblem[]; skippedRows: number }) {
  return (
    <section aria-labelledby="problems-heading" className="checkups__section" data-testid="problems">
      <h2 id="problems-heading">{problemsHeading(problems.length, skippedRows)}</h2>
      {problems.length > 0 ? (
        <ul className="checkups__problems">
          {problems.slice(0, SHOWN).map((p, i) => (
            <li key={i}>{problemLine(p)}</li>
          ))}
        </ul>
      ) : null}
      {problems.length > SHOWN ? <p>The first {SHOWN} are listed.</p> : null}
    </section>
  );
}
