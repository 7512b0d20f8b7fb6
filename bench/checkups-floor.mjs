/**
 * The floor for `hundredfold checkups` (bench/checkups.bench.ts): what Node itself needs to read
 * the same CSV file as a stream and split every line into its fields — no checking, no output but
 * a count. The command cannot be faster than this; the benchmark reports its multiple.
 */
import { createReadStream } from 'node:fs';

let rest = '';
let rows = 0;
let fields = 0;
for await (const chunk of createReadStream(process.argv[2], { encoding: 'utf8', highWaterMark: 1 << 20 })) {
  const lines = (rest + chunk).split('\n');
  rest = lines.pop() ?? '';
  for (const line of lines) {
    fields += line.split(',').length;
    rows += 1;
  }
}
if (rest !== '') {
  fields += rest.split(',').length;
  rows += 1;
}
process.stdout.write(`${rows} rows, ${fields} fields\n`);
