'use client';
/** A list of problems (issues), each on its own line, with a heading that says nothing was saved. */
import type { Issue } from '@/lib/result';

export interface ProblemListProps {
  readonly problems: readonly Issue[];
  /** Heading, e.g. "3 problems in north.csv — nothing was saved". */
  readonly heading: string;
  /** Id for aria-describedby from the control the problems belong to. */
  readonly id?: string;
}

export function ProblemList({ problems, heading, id }: ProblemListProps) {
  if (problems.length === 0) return null;
  return (
    <div className="library__problems" id={id} role="alert">
      <p className="library__problems-heading">{heading}</p>
      <ul>
        {problems.map((p, i) => (
          <li key={`${i}-${p.code}`}>{p.message}</li>
        ))}
      </ul>
    </div>
  );
}

/** "1 problem" / "3 problems". */
export function countProblems(problems: readonly Issue[]): string {
  const n = problems.filter((p) => p.code !== 'too-many-problems').length;
  const more = problems.some((p) => p.code === 'too-many-problems') ? ' (and more)' : '';
  return `${n.toLocaleString('en-GB')} ${n === 1 ? 'problem' : 'problems'}${more}`;
}
