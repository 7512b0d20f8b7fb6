import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it, vi } from 'vitest';

const ROOT = join(__dirname, '..', '..');

/** Every .ts/.tsx file under a folder of the repository. */
function sources(folder: string): string[] {
  const out: string[] = [];
  const visit = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) visit(path);
      else if (/\.tsx?$/.test(name)) out.push(path);
    }
  };
  visit(join(ROOT, folder));
  return out;
}

describe('zod is configured once, before any schema is built (lib/zod.ts)', () => {
  it('no module of the app or the engine imports zod itself, except lib/zod.ts (type-only imports aside)', () => {
    const offenders = [...sources('lib'), ...sources('app')]
      .filter((file) => relative(ROOT, file) !== join('lib', 'zod.ts'))
      .filter((file) => /^\s*import\s+(?!type\b)[^;]*from\s+['"]zod(\/[^'"]*)?['"]/m.test(readFileSync(file, 'utf8')))
      .map((file) => relative(ROOT, file));
    expect(offenders).toEqual([]);
  });

  it('builds and parses the scenario schema without ever making a function from text (no eval under the CSP)', async () => {
    const made: unknown[] = [];
    const RealFunction = globalThis.Function;
    // Any `Function(...)` / `new Function(...)` from here on is recorded, then run as usual.
    const recording = new Proxy(RealFunction, {
      construct(target, args) {
        made.push(args);
        return Reflect.construct(target, args);
      },
      apply(target, self, args) {
        made.push(args);
        return Reflect.apply(target, self, args);
      },
    });
    vi.stubGlobal('Function', recording);
    try {
      // The schema modules alone must bring the setting with them: lib/zod.ts is not imported here first.
      const { parseScenario } = await import('@/lib/scenario/parse');
      const { z } = await import('zod');
      const parsed = parseScenario({ baseline: { risk: 0.08, years: 10 }, effect: { measure: 'RR', estimate: 1.5, lower: 1.2, upper: 1.9 } });
      expect(parsed.ok).toBe(true);
      expect(z.config().jitless).toBe(true);
    } finally {
      vi.unstubAllGlobals();
    }
    expect(made).toEqual([]);
  });
});
