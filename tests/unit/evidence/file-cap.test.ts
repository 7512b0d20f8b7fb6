import { describe, expect, it } from 'vitest';
import { EVIDENCE_FILE_FORMAT, parseEvidenceJson } from '@/lib/evidence/file';
import { MAX_LISTED_PROBLEMS } from '@/lib/files/problems';

// Issue 14 item 9: the evidence problem list is capped as the table CSV import caps its own.
describe('evidence file: a file with very many problems', () => {
  it('lists at most the cap, then one line saying how many more', () => {
    // 3,000 entries, each a bare number: one "not an entry" problem each (hand-counted: 3,000 problems).
    const text = JSON.stringify({ format: EVIDENCE_FILE_FORMAT, version: 1, entries: Array.from({ length: 3000 }, (_, i) => i) });
    const r = parseEvidenceJson(text);
    expect(r.ok).toBe(false);
    const issues = r.ok ? [] : r.issues;
    expect(issues).toHaveLength(MAX_LISTED_PROBLEMS + 1);
    expect(issues.at(-1)?.code).toBe('too-many-problems');
    expect(issues.at(-1)?.message).toBe('… and 2,000 more problems not listed; fix the ones above and check again');
  });
});
