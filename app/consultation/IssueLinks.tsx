/** A list of issues, each a link to the form field it is about (ids from ./fields.tsx). */
import type { Issue } from '@/lib/result';
import { andMore } from '@/lib/wording/screen';
import { fieldDomId } from './fields';

const SHOWN_ISSUES = 8;

export function IssueLinks({ issues, labelledBy }: { issues: readonly Issue[]; labelledBy: string }) {
  const shown = issues.slice(0, SHOWN_ISSUES);
  return (
    <>
      <ul aria-labelledby={labelledBy}>
        {shown.map((issue) => (
          <li key={`${issue.path.join('.')}-${issue.code}`}>
            <a href={`#${fieldDomId(issue.path.join('.'))}`}>{issue.message}</a>
          </li>
        ))}
      </ul>
      {issues.length > shown.length ? <p>{andMore(issues.length - shown.length)}</p> : null}
    </>
  );
}

