import { describe, expect, it } from 'vitest';
import { statusCode, statusOfCode } from '@/lib/checkups/statusCode';
import { WORKER_STATUSES, type WorkerStatus } from '@/lib/workforce';

describe('statusCode', () => {
  it('numbers the statuses in lib/workforce’s order and reads them back (hand-worked)', () => {
    expect(statusCode('exposed')).toBe(0);
    expect(statusCode('insufficient')).toBe(4);
    expect(statusOfCode(2)).toBe('neither');
    for (const s of WORKER_STATUSES) expect(statusOfCode(statusCode(s))).toBe(s);
  });

  it('refuses what is not a status, and a code that stands for none', () => {
    expect(() => statusCode('diabetes' as WorkerStatus)).toThrow(RangeError);
    expect(statusOfCode(5)).toBeUndefined();
    expect(statusOfCode(-1)).toBeUndefined();
  });
});
