/** Validates anything that claims to be an {@link EvidenceEntry}: a stored entry, an import, the form. */
import { fail, ok, type Result } from '../result';
import { toIssues } from '../validation/issues';
import { evidenceEntrySchema, type EvidenceEntry } from './schema';

/**
 * Validate an evidence entry.
 *
 * @example
 * parseEvidenceEntry({ id: 'e1', title: 'T', effect: { measure: 'HR', estimate: 1.5, lower: 1.2, upper: 1.9 }, wording: {}, illustrative: false })
 * //=> { ok: true, value: { id: 'e1', … } }
 */
export function parseEvidenceEntry(input: unknown): Result<EvidenceEntry> {
  const parsed = evidenceEntrySchema.safeParse(input, { reportInput: true });
  if (parsed.success) return ok(parsed.data);
  return fail(toIssues(parsed.error.issues));
}
