// Reads a records file with the registry CSV parser (csv-parse, sync API) and keeps where every
// cell stands, so each problem can name its line and column. The parser decides what the cells
// are; a small walker over each record's raw text only measures where they start and end.
import { parse } from 'csv-parse/sync';
import { finding, type Finding } from '../findings';
import type { Cell } from './types';

export type Delimiter = ',' | ';' | '\t';
const DELIMITERS: Delimiter[] = [',', ';', '\t'];

export interface CsvRow {
  /** 0-based line where the row starts. */
  line: number;
  cells: Cell[];
}

export interface CsvRead {
  delimiter: Delimiter;
  /** The first non-blank row, or null for a file with none. */
  header: CsvRow | null;
  rows: CsvRow[];
  /** Rows the parser could not read. */
  findings: Finding[];
}

/**
 * The delimiter of the header line: whichever of comma, semicolon and tab occurs most often in
 * the first non-blank line outside quotes (header names are plain words, so this is reliable).
 * Ties and a line with none fall back to the comma.
 */
export function detectDelimiter(text: string): Delimiter {
  const first = text.split('\n').find((l) => l.trim() !== '') ?? '';
  const unquoted = first.replace(/"[^"]*"/g, '');
  let best: Delimiter = ',';
  let most = 0;
  for (const d of DELIMITERS) {
    const n = unquoted.split(d).length - 1;
    if (n > most) [best, most] = [d, n];
  }
  return best;
}

/** Cell ranges of one record's raw text, starting at a line's first character. */
function cellRanges(body: string, line: number, delimiter: string): { line: number; character: number; endLine: number; endCharacter: number }[] {
  const out = [];
  let i = 0;
  let l = line;
  let c = 0;
  const step = () => {
    if (body[i] === '\n') {
      l++;
      c = 0;
    } else c++;
    i++;
  };
  for (;;) {
    const start = { line: l, character: c };
    if (body[i] === '"') {
      step();
      while (i < body.length) {
        if (body[i] === '"' && body[i + 1] === '"') {
          step();
          step();
        } else if (body[i] === '"') {
          step();
          break;
        } else step();
      }
    }
    while (i < body.length && body[i] !== delimiter && body[i] !== '\n') step();
    out.push({ ...start, endLine: l, endCharacter: c });
    if (body[i] !== delimiter) break;
    step();
  }
  return out;
}

interface ParsedRecord {
  record: string[];
  raw: string;
  info: { lines: number };
}

/**
 * Splits records text into rows of cells. `text` is the file's text without a byte-order mark;
 * CRLF and lone CR line ends are read as LF (every position stays the same, since CR only ends a
 * line). Records the parser cannot read become findings; the others are kept.
 */
export function readCsv(text: string): CsvRead {
  const lf = text.replace(/\r\n?/g, '\n');
  const delimiter = detectDelimiter(lf);
  const findings: Finding[] = [];
  let records: ParsedRecord[] = [];
  try {
    records = parse(lf, {
      delimiter,
      info: true,
      raw: true,
      relax_column_count: true,
      relax_quotes: true,
      skip_empty_lines: true,
      skip_records_with_error: true,
      on_skip: (err: { message: string; lines?: number } | undefined) => {
        if (!err) return;
        const line = Math.max(0, (err.lines ?? 1) - 1);
        findings.push(syntaxFinding(line, err.message));
      },
    }) as unknown as ParsedRecord[];
  } catch (err) {
    // With skip_records_with_error the parser still stops at an unclosed quote at the end.
    const e = err as { message?: string; lines?: number };
    findings.push(syntaxFinding(Math.max(0, (e.lines ?? 1) - 1), e.message ?? String(err)));
  }
  const rows: CsvRow[] = [];
  for (const r of records) {
    const body = r.raw.replace(/^\n+/, '');
    const spanned = body.replace(/\n$/, '').split('\n').length;
    const line = r.info.lines - spanned;
    const ranges = cellRanges(body, line, delimiter);
    const cells: Cell[] = r.record.map((value, k) => {
      const at = ranges[k] ?? ranges[ranges.length - 1];
      return { value, ...(ranges[k] ? at : { line: at.endLine, character: at.endCharacter, endLine: at.endLine, endCharacter: at.endCharacter }) };
    });
    // A line of blanks (spaces, or delimiters only) carries no measurement.
    if (cells.every((x) => x.value.trim() === '')) continue;
    rows.push({ line, cells });
  }
  const header = rows.shift() ?? null;
  return { delimiter, header, rows, findings };
}

function syntaxFinding(line: number, message: string): Finding {
  return finding({ line, character: 0, endLine: line, endCharacter: 0 }, { kind: 'record-syntax', explanation: message.replace(/\s+at line \d+.*$/, '') });
}
