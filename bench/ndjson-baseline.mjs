/**
 * The yardstick for `hundredfold compute --ndjson` (issue 2 §5): what Node itself needs to
 * read the same lines, JSON.parse each and JSON.stringify it back, one line out per line in.
 * It reads and writes exactly as the command does (whole chunks split into lines, one write
 * per chunk, waiting on a slow reader), so the ratio measures the engine's work, not I/O style.
 */
const source = process.stdin;
source.setEncoding('utf8');
let rest = '';
for await (const chunk of source) {
  const text = rest + chunk;
  const out = [];
  let start = 0;
  for (let end = text.indexOf('\n'); end >= 0; end = text.indexOf('\n', start)) {
    const line = text.slice(start, end);
    start = end + 1;
    if (/\S/.test(line)) out.push(JSON.stringify(JSON.parse(line)), '\n');
  }
  rest = text.slice(start);
  if (!process.stdout.write(out.join(''))) await new Promise((resolve) => process.stdout.once('drain', resolve));
}
if (/\S/.test(rest)) process.stdout.write(`${JSON.stringify(JSON.parse(rest))}\n`);
