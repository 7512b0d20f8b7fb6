'use client';
/**
 * What a screen says about the link it was opened with (lib/link `readScenarioLink`): nothing
 * for a plain visit or a whole link; the parameters left out when the rest made a scenario; why
 * there is no scenario when there is none — a link cut short first, as the real cause.
 */
import { IssueNotice } from '@/app/components/IssueNotice';
import type { LinkReading } from '@/lib/link';
import type { Issue } from '@/lib/result';

export interface LinkNoticeProps {
  readonly reading: LinkReading | undefined;
  /** The sentence before the list when the link gives no scenario, e.g. "This link could not be read, so the form starts empty:". */
  readonly refused: string;
  /** Extra class names (e.g. "controls" on /handout, which print hides). */
  readonly className?: string;
}

/** The issues to list, the cut-short cause first, each once. */
export function linkNoticeIssues(reading: LinkReading): readonly Issue[] {
  const list = [...(reading.cutShort ? [reading.cutShort] : []), ...(reading.result.ok ? [] : reading.result.issues), ...reading.dropped];
  return list.filter((issue, i) => list.findIndex((other) => other.message === issue.message) === i);
}

export function LinkNotice({ reading, refused, className }: LinkNoticeProps) {
  if (reading === undefined || reading.empty) return null;
  const issues = linkNoticeIssues(reading);
  if (issues.length === 0) return null;
  const opened = reading.result.ok;
  return (
    <IssueNotice
      lead={opened ? 'Part of this link could not be read and was left out; what is shown is without it. Check these fields:' : refused}
      issues={issues}
      {...(className ? { className } : {})}
      testId="link-notice"
    />
  );
}
