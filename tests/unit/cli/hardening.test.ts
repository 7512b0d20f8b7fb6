import { describe, expect, it } from 'vitest';
import { parseJsonStrict, MAX_OBJECT_KEYS } from '@/lib/cli/json';
import { decodeUtf8Strict, firstInvalidUtf8 } from '@/lib/cli/io';
import { escapeForTerminal } from '@/lib/cli/terminal';
import { parseScenario } from '@/lib/scenario/parse';

// Byte sequences below are from RFC 3629 §3-4 (UTF-8 encoding table and the ill-formed forms it
// names: overlong, surrogates, above U+10FFFF) (from memory); escapes are hand-written.

describe('escapeForTerminal', () => {
  it('writes control characters as visible escapes and leaves other text alone', () => {
    expect(escapeForTerminal('risk\u001b[31mred')).toBe('risk\\x1b[31mred');
    expect(escapeForTerminal('a\nb\rc\td')).toBe('a\\nb\\rc\\td');
    expect(escapeForTerminal('\u0000\u0007\u007f\u0085\u009b')).toBe('\\x00\\x07\\x7f\\x85\\x9b');
    expect(escapeForTerminal('left\u202eright\u2066x\u2069\u2028')).toBe('left\\u202eright\\u2066x\\u2069\\u2028');
    expect(escapeForTerminal('plain é 中 😀 \\ "quoted"')).toBe('plain é 中 😀 \\ "quoted"');
  });

  it('never lets a control character through (every code unit below U+00A0)', () => {
    for (let c = 0; c < 0xa0; c += 1) {
      const shown = escapeForTerminal(String.fromCharCode(c));
      expect(shown).not.toMatch(/[\u0000-\u001f\u007f-\u009f]/);
    }
  });
});

describe('strict UTF-8', () => {
  it('finds the first byte that is not UTF-8, or -1', () => {
    expect(firstInvalidUtf8(Buffer.from('héllo 中 😀', 'utf8'))).toBe(-1);
    expect(firstInvalidUtf8(Uint8Array.from([0x61, 0xff]))).toBe(1);
    expect(firstInvalidUtf8(Uint8Array.from([0xc0, 0xaf]))).toBe(0); // overlong "/"
    expect(firstInvalidUtf8(Uint8Array.from([0xed, 0xa0, 0x80]))).toBe(0); // U+D800, a surrogate
    expect(firstInvalidUtf8(Uint8Array.from([0xf4, 0x90, 0x80, 0x80]))).toBe(0); // above U+10FFFF
    expect(firstInvalidUtf8(Uint8Array.from([0x61, 0xe4, 0xb8]))).toBe(1); // cut short
    expect(firstInvalidUtf8(Uint8Array.from([0xe9]))).toBe(0); // Latin-1 "é"
  });

  it('refuses bytes that are not UTF-8 with the line, and drops a byte-order mark', () => {
    const bad = decodeUtf8Strict(Buffer.concat([Buffer.from('{\n"a": "caf'), Buffer.from([0xe9]), Buffer.from('"}')]), 'the input');
    expect(bad.ok).toBe(false);
    // Hand-counted: `{`, newline, `"a": "caf` are 11 bytes, so 0xe9 is byte 12, on line 2.
    if (!bad.ok) expect(bad.problem).toMatch(/^the input is not UTF-8 text: byte 0xe9 at line 2 \(byte 12\)/);
    const utf16 = decodeUtf8Strict(Buffer.from('\ufeff{}', 'utf16le'), 'it');
    expect(!utf16.ok && utf16.problem).toContain('It looks like UTF-16');
    expect(decodeUtf8Strict(Buffer.from('\ufeff{"a":1}', 'utf8'), 'x')).toEqual({ ok: true, text: '{"a":1}' });
    expect(JSON.stringify(decodeUtf8Strict(Uint8Array.from([0x22, 0xff, 0x22]), 'x'))).not.toContain('\ufffd');
  });
});

describe('parseJsonStrict', () => {
  it('refuses a key given twice, naming it and where', () => {
    expect(parseJsonStrict('{"baseline": {"risk": 0.08, "years": 10, "risk": 0.8}}')).toEqual({
      ok: false,
      issues: [{ code: 'invalid-json', path: ['baseline', 'risk'], message: expect.stringContaining('gives "risk" twice in baseline') as unknown as string }],
    });
    expect(parseJsonStrict('{"a": 1, "a": 1}')).toMatchObject({ ok: false, issues: [{ path: ['a'] }] });
    // The same key written two ways ("\u0061" is "a") is still the same key.
    expect(parseJsonStrict('{"a": 1, "\\u0061": 2}')).toMatchObject({ ok: false, issues: [{ path: ['a'] }] });
    // Inside arrays, with the index in the path.
    expect(parseJsonStrict('{"checkups": [{"date": "x"}, {"date": "y", "date": "z"}]}')).toMatchObject({ ok: false, issues: [{ path: ['checkups', 1, 'date'] }] });
  });

  it('accepts the same key in different objects, strings that look like keys, and any nesting', () => {
    expect(parseJsonStrict('{"a": {"b": 1}, "c": {"b": 2}, "d": "\\"b\\": 1, \\"b\\": 2", "e": [{"b": 1}, {"b": 2}]}').ok).toBe(true);
    expect(parseJsonStrict(`${'['.repeat(5000)}${']'.repeat(5000)}`).ok).toBe(true);
    expect(parseJsonStrict('"text"')).toEqual({ ok: true, value: 'text' });
  });

  it('refuses an object with more keys than any input has, in one issue', () => {
    const keys = Array.from({ length: MAX_OBJECT_KEYS + 1 }, (_, i) => `"k${i}": 1`).join(',');
    const r = parseJsonStrict(`{"x": {${keys}}}`);
    expect(r).toMatchObject({ ok: false, issues: [{ code: 'invalid-json', path: ['x'] }] });
    expect(!r.ok && r.issues).toHaveLength(1);
  });

  it('reports malformed JSON as an issue, never a throw', () => {
    expect(parseJsonStrict('{"a": ')).toMatchObject({ ok: false, issues: [{ code: 'invalid-json', path: [] }] });
  });
});

describe('parseScenario with a huge number of unknown keys', () => {
  it('returns one issue per key and does not overflow the stack (125,000 keys)', () => {
    const input: Record<string, unknown> = { baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } };
    for (let i = 0; i < 125_000; i += 1) input[`k${i}`] = 1;
    const r = parseScenario(input);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.issues).toHaveLength(125_000);
      expect(r.issues[0]).toMatchObject({ code: 'unknown-field', path: ['k0'] });
    }
  });
});
