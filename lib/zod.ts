/**
 * zod, configured once for the whole app and the command line: every module that builds a schema
 * imports `z` from here, never from 'zod' directly (tests/unit/zodConfig.test.ts checks), so this
 * setting is in force before any schema exists.
 *
 * `jitless: true` stops zod compiling object parsers with `new Function`, and with it the
 * `Function("")` probe zod otherwise runs to see whether it may: under the app's Content Security
 * Policy (no 'unsafe-eval') the probe is refused and the browser logs a policy violation on every
 * page load. Parsing gives the same results either way (zod's interpreted path); only the
 * compiled fast path is given up.
 */
import { z } from 'zod';

z.config({ jitless: true });

export { z };
