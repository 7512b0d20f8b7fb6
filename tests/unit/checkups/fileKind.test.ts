import { describe, expect, it } from 'vitest';
import { checkupFileKind, MAX_CHECKUP_FILE_BYTES } from '../../../lib/checkups/fileKind';
import { checkupsProgressView } from '../../../lib/checkups/progress';

const text = (s: string) => new TextEncoder().encode(s);

describe('checkupFileKind', () => {
  it('takes text as CSV/TSV, NDJSON by name or content, and a zip named .xlsx as a workbook', () => {
    expect(checkupFileKind('a.csv', 10, text('Worker,Date'))).toEqual({ kind: 'delimited' });
    expect(checkupFileKind('Patient.ndjson', 10, text('{"resourceType":"Patient"}'))).toEqual({ kind: 'fhir-ndjson' });
    expect(checkupFileKind('export.txt', 10, text('{"resourceType":"Observation"}'))).toEqual({ kind: 'fhir-ndjson' });
    expect(checkupFileKind('book.xlsx', 10, new Uint8Array([0x50, 0x4b, 0x03, 0x04]))).toEqual({ kind: 'xlsx' });
  });

  it('refuses a PDF renamed .csv, an image, a zip that is not a workbook and a file over 100 MB with one sentence', () => {
    // magic numbers: "%PDF", PNG 89 50 4E 47, zip "PK\x03\x04" (from memory)
    expect(checkupFileKind('checkups.csv', 10, text('%PDF-1.7'))).toMatchObject({ kind: 'refused', code: 'pdf' });
    expect(checkupFileKind('x.csv', 10, new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))).toMatchObject({ kind: 'refused', code: 'image' });
    expect(checkupFileKind('x.zip', 10, new Uint8Array([0x50, 0x4b, 0x03, 0x04]))).toMatchObject({ kind: 'refused', code: 'zip' });
    expect(checkupFileKind('x.csv', MAX_CHECKUP_FILE_BYTES + 1, text('a'))).toMatchObject({ kind: 'refused', code: 'too-large' });
    expect(checkupFileKind('x.csv', MAX_CHECKUP_FILE_BYTES, text('a'))).toEqual({ kind: 'delimited' });
    expect(MAX_CHECKUP_FILE_BYTES).toBe(104857600); // 100 × 1024 × 1024 (hand-computed)
  });
});

describe('checkupsProgressView', () => {
  it('counts reading as the first half and evaluating as the second, with linear time left', () => {
    // reading 50 of 100 chars → 0.25; elapsed 1 s → total 4 s, 3 s left (hand-computed)
    expect(checkupsProgressView({ phase: 'reading', charsDone: 50, rowsRead: 1000, workersDone: 0, workersTotal: null }, 100, 1000)).toEqual({
      fraction: 0.25,
      text: 'Rows read: 1,000 · workers done: 0 of …',
      timeLeft: 'about 3 s left',
    });
    // evaluating 50 of 100 → 0.75; elapsed 3 s → total 4 s, 1 s left (hand-computed)
    expect(checkupsProgressView({ phase: 'evaluating', charsDone: 100, rowsRead: 10, workersDone: 50, workersTotal: 100 }, 100, 3000).timeLeft).toBe('about 1 s left');
  });
});
