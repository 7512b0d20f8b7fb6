/**
 * Text from an input file shown on a terminal. A key or a cell may hold control characters —
 * an escape sequence (ESC, U+001B) can move the cursor, recolour or retitle the terminal, or hide
 * what follows — so every command shows them escaped, never raw.
 */

/**
 * Characters shown escaped: C0 controls and DEL (U+0000–U+001F, U+007F), C1 controls
 * (U+0080–U+009F), the Unicode line and paragraph separators (U+2028, U+2029), and the
 * bidirectional overrides and isolates (U+202A–U+202E, U+2066–U+2069), which reorder what a
 * terminal shows (Unicode Standard Annex #9; common practice for source and log viewers).
 */
const UNSAFE = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g;

const NAMED: Readonly<Record<string, string>> = { '\n': '\\n', '\r': '\\r', '\t': '\\t' };

/**
 * The text with every control character written as a visible escape — `\n`, `\r`, `\t`, else
 * `\xHH` (below U+0100) or `\uHHHH` — so that printing it cannot act on the terminal. Other
 * text, backslashes included, is unchanged. Pure; use it on anything from the input before it
 * reaches stderr or a terminal (`complain` in ./io.ts already does, for every message).
 *
 * @example
 * escapeForTerminal('risk\u001b[31m')
 * //=> "risk\\x1b[31m"
 * escapeForTerminal('a\tb\u202ec')
 * //=> "a\\tb\\u202ec"
 */
export function escapeForTerminal(text: string): string {
  return text.replace(UNSAFE, (char) => {
    const named = NAMED[char];
    if (named !== undefined) return named;
    const code = char.charCodeAt(0);
    return code < 0x100 ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u${code.toString(16).padStart(4, '0')}`;
  });
}
