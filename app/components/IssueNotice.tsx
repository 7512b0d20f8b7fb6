'use client';
/**
 * A notice that something handed to this screen could not be used: one lead sentence, then each
 * issue's message on its own line (errors are data: lib/ gives the issues, this only shows them).
 * Used for a link that could not be read (app/link/LinkNotice.tsx) and a worker from the checkups
 * screen whose record could not be used (app/checkups/workerHandOver.ts).
 */
import type { Issue } from '@/lib/result';

export interface IssueNoticeProps {
  /** The sentence before the list, e.g. "This link could not be read, so the form starts empty:". */
  readonly lead: string;
  readonly issues: readonly Issue[];
  /** Extra class names (e.g. "controls" on /handout, which print hides). */
  readonly className?: string;
  readonly testId: string;
}

export function IssueNotice({ lead, issues, className, testId }: IssueNoticeProps) {
  return (
    <div className={`link-problem${className ? ` ${className}` : ''}`} role="alert" data-testid={testId}>
      <p>{lead}</p>
      <ul>
        {issues.map((issue, i) => (
          <li key={`${issue.path.join('.')}-${issue.code}-${i}`}>{issue.message}</li>
        ))}
      </ul>
    </div>
  );
}
