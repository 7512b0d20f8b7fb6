import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fileKindCode, fileKindSentence, sniffBytes, sniffText, SNIFF_BYTES } from '@/lib/files/kind';

// Signatures from the formats' specifications (from memory): zip "PK\3\4", PDF "%PDF-",
// PNG 89 50 4E 47 0D 0A 1A 0A, JPEG FF D8 FF, GIF "GIF89a", UTF-16 byte-order marks FF FE / FE FF.
const ascii = (s: string) => Uint8Array.from(s, (c) => c.charCodeAt(0));
const utf8 = (s: string) => new TextEncoder().encode(s);
/** Decoded as a browser's File.text() or Node's readFileSync(…, 'utf8') would. */
const decoded = (bytes: Uint8Array) => new TextDecoder('utf-8').decode(bytes);
const utf16le = (s: string, bom = true) => {
  const out = new Uint8Array((bom ? 2 : 0) + s.length * 2);
  if (bom) out.set([0xff, 0xfe]);
  for (let i = 0; i < s.length; i++) {
    out[(bom ? 2 : 0) + i * 2] = s.charCodeAt(i) & 0xff;
    out[(bom ? 2 : 0) + i * 2 + 1] = s.charCodeAt(i) >> 8;
  }
  return out;
};
const utf16be = (s: string) => {
  const out = new Uint8Array(2 + s.length * 2);
  out.set([0xfe, 0xff]);
  for (let i = 0; i < s.length; i++) {
    out[2 + i * 2] = s.charCodeAt(i) >> 8;
    out[3 + i * 2] = s.charCodeAt(i) & 0xff;
  }
  return out;
};
const CSV = '# title: Test table\nsex,age_from,age_to,risk\nfemale,30,39,0.01\n';

const SAMPLES: [string, Uint8Array][] = [
  ['xlsx', ascii('PK\u0003\u0004\u0014\u0000\u0006\u0000\u0008\u0000[Content_Types].xml\u0000\u0000PK\u0003\u0004xl/workbook.xml')],
  ['zip', ascii('PK\u0003\u0004\u0014\u0000\u0000\u0000notes.txt\u0000\u0000')],
  ['pdf', ascii('%PDF-1.7\n%\u00e2\u00e3\u00cf\u00d3\n1 0 obj\n')],
  ['png', Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52])],
  ['jpeg', Uint8Array.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01])],
  ['gif', ascii('GIF89a\u0001\u0000\u0001\u0000\u0080\u0000\u0000')],
  ['utf16', utf16le(CSV)],
  ['utf16', utf16le('é,ü\n', true)],
  ['utf16', utf16be(CSV)],
  ['utf16', utf16le(CSV, false)],
  ['binary', Uint8Array.from([0x01, 0x02, 0x00, 0x7f, 0x41, 0x42, 0x43, 0x44, 0x45, 0x46])],
  ['text', utf8(CSV)],
  ['text', utf8(`\uFEFF${CSV}`)],
  ['text', utf8('sexe;âge;risque\nfemme;30;0,01\n')],
  ['empty', new Uint8Array()],
];

describe('sniffBytes and sniffText', () => {
  it.each(SAMPLES)('knows %s from its first bytes', (kind, bytes) => {
    expect(sniffBytes(bytes)).toBe(kind);
  });

  it.each(SAMPLES)('knows %s after the file was decoded as UTF-8', (kind, bytes) => {
    expect(sniffText(decoded(bytes))).toBe(kind);
  });

  it('property: any text without control characters is text, as bytes and as decoded text', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', minLength: 1, maxLength: 200 }), (s) => {
        fc.pre(!/[\u0000-\u0008\u000e-\u001f]/.test(s) && !s.startsWith('PK') && !s.startsWith('%PDF-') && !s.startsWith('GIF8'));
        expect(sniffBytes(utf8(s))).toBe('text');
        expect(sniffText(s)).toBe('text');
      }),
      { numRuns: 500 },
    );
  });

  it('reads only the first bytes (a NUL far into the file does not count)', () => {
    const late = utf8(`${'a'.repeat(SNIFF_BYTES + 10)}\u0000`);
    expect(sniffBytes(late)).toBe('text');
  });
});

describe('fileKindSentence', () => {
  it('gives one sentence for a workbook, naming what to do', () => {
    expect(fileKindSentence('xlsx')).toBe(
      'This is a spreadsheet workbook (.xlsx), not a CSV file; open it in the spreadsheet program and save it as CSV (UTF-8), then choose the CSV file',
    );
    expect(fileKindSentence('utf16')).toMatch(/UTF-16.*CSV UTF-8/);
    expect(fileKindSentence('pdf', 'an evidence file (.json)')).toBe(
      'This is a PDF document, not an evidence file (.json); choose the evidence file (.json) the figures came from, or type them into a spreadsheet and save it as CSV (UTF-8)',
    );
  });

  it('says nothing for text or an empty file', () => {
    expect(fileKindSentence('text')).toBeUndefined();
    expect(fileKindSentence('empty')).toBeUndefined();
    expect(fileKindCode('text')).toBeUndefined();
    expect(fileKindCode('utf16')).toBe('wrong-encoding');
    expect(fileKindCode('png')).toBe('not-a-text-file');
  });
});
