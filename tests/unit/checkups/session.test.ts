import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEMO_EVIDENCE } from '../../../lib/evidence/demo';
import { DEMO_HEART_FAILURE_10Y } from '../../../lib/tables/demo';
import { createCheckupTextReader, isRefusal, type CheckupRow } from '../../../lib/workforce';
import {
  checkSessionName,
  newSessionId,
  readSession,
  readSessionSummary,
  SESSION_VERSION,
  summariseSession,
  type CheckupSession,
} from '../../../lib/checkups/session';

/** The rows the engine reads from the illustrative demo file (demo/checkups/checkups.csv). */
function demoRows(): { rows: CheckupRow[]; counts: { read: number; used: number; skipped: number } } {
  const reader = createCheckupTextReader({ today: '2026-01-01' });
  const first = reader.push(readFileSync('demo/checkups/checkups.csv', 'utf8'));
  const last = reader.end();
  if (isRefusal(first) || isRefusal(last)) throw new Error('the demo file must read');
  return { rows: [...first.rows, ...last.rows], counts: reader.counts() };
}

function session(): CheckupSession {
  const { rows, counts } = demoRows();
  return {
    sessionVersion: SESSION_VERSION,
    id: 'session-0123456789abcdef01234567',
    name: 'Spring site visits',
    setup: { evidence: DEMO_EVIDENCE[0]!, table: DEMO_HEART_FAILURE_10Y, criteria: 'ADA', horizonYears: null },
    today: '2026-01-01',
    kind: 'delimited',
    mapping: { columns: [{ index: 0, header: 'Worker', field: 'worker', unit: null, stratum: null, identifying: false }] },
    rows,
    rowCounts: counts,
    problems: [{ line: 7, column: 'Checkup date', code: 'invalid-date', message: 'The date must be written YYYY-MM-DD (got "not a date")' }],
  };
}

describe('saved checkups sessions', () => {
  it('reads back exactly what was saved, through the structured clone storage uses (JSON here)', () => {
    const s = session();
    expect(s.rows.length).toBeGreaterThan(100); // the demo file: 40 workers' yearly rows
    const read = readSession(JSON.parse(JSON.stringify(s)));
    expect(read).toEqual({ ok: true, value: s });
  });

  it('summarises a session for the list: workers counted once, rows, evidence, table, criteria', () => {
    const summary = summariseSession(session());
    expect(summary).toMatchObject({ name: 'Spring site visits', workers: 40, evidenceTitle: DEMO_EVIDENCE[0]!.title, tableTitle: DEMO_HEART_FAILURE_10Y.title, criteria: 'ADA' });
    expect(readSessionSummary(JSON.parse(JSON.stringify(summary)))).toEqual({ ok: true, value: summary });
  });

  it('refuses a session saved by a newer version, saying so, without touching what it was given', () => {
    const future = { ...JSON.parse(JSON.stringify(session())), sessionVersion: SESSION_VERSION + 1, someNewField: [1, 2] };
    const before = JSON.stringify(future);
    const read = readSession(future);
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.issues).toEqual([
      {
        code: 'newer-record',
        path: ['sessionVersion'],
        message: `The saved session “Spring site visits” was saved by a newer version of Hundredfold (session format ${SESSION_VERSION + 1}; this one reads ${SESSION_VERSION}): it is kept as it is; update the program to open it`,
      },
    ]);
    expect(JSON.stringify(future)).toBe(before);
    expect(readSessionSummary({ ...summariseSession(session()), sessionVersion: 9 })).toMatchObject({ ok: false, issues: [{ code: 'newer-record' }] });
  });

  it('calls a record without a version, or not an object, damaged', () => {
    const { sessionVersion: _v, ...noVersion } = session();
    expect(readSession(noVersion)).toMatchObject({ ok: false, issues: [{ code: 'damaged-record', path: ['sessionVersion'] }] });
    expect(readSession('text')).toMatchObject({ ok: false, issues: [{ code: 'damaged-record', path: [] }] });
    expect(readSession(null)).toMatchObject({ ok: false, issues: [{ code: 'damaged-record' }] });
  });

  it('keeps no field a checkup row does not have: a name slipped into a row is refused as damage', () => {
    const s = session();
    const bad = { ...s, rows: [{ ...s.rows[0]!, name: 'Jane Doe' }, ...s.rows.slice(1)] };
    const read = readSession(JSON.parse(JSON.stringify(bad)));
    expect(read).toMatchObject({ ok: false, issues: [{ code: 'damaged-record', path: ['rows', 0, 'name'] }] });
  });

  it('refuses an implausible reading in a stored row (the glucose history’s own bounds)', () => {
    const s = session();
    const bad = { ...s, rows: [{ ...s.rows[0]!, hba1c: { value: 99, unit: '%' } }] };
    expect(readSession(bad)).toMatchObject({ ok: false, issues: [{ code: 'damaged-record', path: ['rows', 0, 'hba1c', 'value'] }] });
  });

  it('takes a name of the physician’s own, trimmed, 1 to 120 characters', () => {
    expect(checkSessionName('  North site  ')).toEqual({ ok: true, value: 'North site' });
    expect(checkSessionName('   ')).toMatchObject({ ok: false, issues: [{ path: ['name'] }] });
    expect(checkSessionName('x'.repeat(121))).toMatchObject({ ok: false, issues: [{ path: ['name'] }] });
  });

  it('makes random ids that say nothing about the name', () => {
    expect(newSessionId(() => 0.5)).toBe(`session-${'8'.repeat(24)}`);
    expect(newSessionId()).toMatch(/^session-[0-9a-f]{24}$/);
    expect(newSessionId()).not.toBe(newSessionId());
  });
});
