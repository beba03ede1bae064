// Where and why a `.rungs.json` file is not JSON. JSON.parse decides (so the file means what any
// JSON reader would make of it); this module turns its error into an offset and a short message.
// JSON.parse names the offset for most errors ("... in JSON at position 12"), but not for an
// unexpected token (a trailing comma, a comment); then the offset is found as the end of the
// longest prefix that could still begin a valid JSON text.

export interface JsonSyntaxError {
  /** Offset in the text (UTF-16 code units) where reading failed. */
  offset: number;
  message: string;
}

function parseError(text: string): string | null {
  try {
    JSON.parse(text);
    return null;
  } catch (err) {
    return err instanceof Error ? err.message : String(err);
  }
}

/** Whether `prefix` could be the start of a valid JSON text (it parses, or only more input is missing). */
function viable(prefix: string): boolean {
  const m = parseError(prefix);
  if (m === null || /^Unexpected end of JSON input/.test(m)) return true;
  const at = /at position (\d+)/.exec(m);
  return at !== null && Number(at[1]) >= prefix.length;
}

/**
 * The first syntax error of a JSON text, or null when JSON.parse reads it. A leading BOM is
 * allowed, and an empty (or blank) file is an empty config rather than an error.
 */
export function jsonSyntaxError(text: string): JsonSyntaxError | null {
  const bom = text.startsWith('\uFEFF') ? 1 : 0;
  const body = text.slice(bom);
  if (!body.trim()) return null;
  const raw = parseError(body);
  if (raw === null) return null;
  let offset: number;
  const at = /at position (\d+)/.exec(raw);
  if (at) offset = Number(at[1]);
  else if (/^Unexpected end of JSON input/.test(raw)) offset = body.length;
  else {
    // Viable prefixes are closed under shortening, so the longest one is found by bisection.
    let lo = 0;
    let hi = body.length;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (viable(body.slice(0, mid))) lo = mid;
      else hi = mid - 1;
    }
    offset = lo;
  }
  let message = raw
    .replace(/, (?:"[\s\S]*"|\.\.\.[\s\S]*\.\.\.) is not valid JSON$/, '')
    .replace(/ in JSON at position \d+(?: \(line \d+ column \d+\))?$/, '');
  if (/^[}\]]/.test(body.slice(offset)) && /,\s*$/.test(body.slice(0, offset))) message += ' (JSON allows no comma after the last entry)';
  if (body.startsWith('//', offset) || body.startsWith('/*', offset)) message += ' (JSON allows no comments; use .rungs.yaml for comments)';
  return { offset: offset + bom, message };
}
