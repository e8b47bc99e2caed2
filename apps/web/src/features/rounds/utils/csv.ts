/**
 * A small CSV reader for pasting or importing joints (Roundbook's own; no library). It reads:
 * - fields separated by commas, semicolons or tabs (the separator is taken from the first line, outside quotes);
 * - quoted fields ("…") that may hold separators, line breaks and doubled quotes ("" → ");
 * - LF, CRLF or CR line ends, a byte-order mark at the start, and blank lines (skipped).
 * Each row keeps the line it started on, so a message can point at it.
 */

export type CsvSeparator = ',' | ';' | '\t';

export interface CsvRow {
  /** 1-based line number where the row starts. */
  line: number;
  fields: string[];
  /** Set when the row could not be read cleanly (e.g. a quote that never closes). */
  problem?: string;
}

export interface CsvResult {
  separator: CsvSeparator;
  rows: CsvRow[];
}

const SEPARATORS: CsvSeparator[] = ['\t', ';', ','];

/** The separator used most on the first line, outside quotes (tab, then semicolon, then comma on ties). */
export function detectSeparator(text: string): CsvSeparator {
  const counts: Record<CsvSeparator, number> = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of text) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === '\n' || ch === '\r')) break;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch] += 1;
  }
  let best: CsvSeparator = ',';
  for (const sep of SEPARATORS) if (counts[sep] > counts[best]) best = sep;
  return best;
}

export function parseCsv(input: string, separator?: CsvSeparator): CsvResult {
  const text = input.startsWith('\uFEFF') ? input.slice(1) : input;
  const sep = separator ?? detectSeparator(text);
  const rows: CsvRow[] = [];
  let fields: string[] = [];
  let field = '';
  let quoted = false;
  let fieldWasQuoted = false;
  let line = 1;
  let rowLine = 1;

  const endRow = () => {
    fields.push(field);
    const blank = fields.length === 1 && fields[0].trim() === '' && !fieldWasQuoted;
    if (!blank) rows.push({ line: rowLine, fields });
    fields = [];
    field = '';
    fieldWasQuoted = false;
  };

  for (let i = 0; i < text.length; i += 1) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i += 1;
        } else {
          quoted = false;
        }
      } else {
        if (ch === '\n' || (ch === '\r' && text[i + 1] !== '\n')) line += 1;
        field += ch;
      }
      continue;
    }
    if (ch === '"' && field.trim() === '') {
      // A quote opens a quoted field only at its start (spaces before it are dropped).
      field = '';
      quoted = true;
      fieldWasQuoted = true;
    } else if (ch === sep) {
      fields.push(field);
      field = '';
      fieldWasQuoted = false;
    } else if (ch === '\r' || ch === '\n') {
      if (ch === '\r' && text[i + 1] === '\n') i += 1;
      endRow();
      line += 1;
      rowLine = line;
    } else {
      field += ch;
    }
  }
  if (quoted) {
    fields.push(field);
    rows.push({
      line: rowLine,
      fields,
      problem: `A quote opened on line ${rowLine} is never closed; the rest of the text was read as one value.`,
    });
  } else if (field !== '' || fields.length > 0 || fieldWasQuoted) {
    endRow();
  }
  return { separator: sep, rows: rows.map((r) => ({ ...r, fields: r.fields.map((f) => f.trim()) })) };
}
