import Papa from 'papaparse';

/**
 * CSV for pasting or importing joints, read with papaparse (RFC 4180 quoting: fields in "…" may hold
 * separators, line breaks and doubled quotes). Around papaparse:
 * - the separator is guessed among tab, semicolon, comma and bar, in that order of preference, so a
 *   semicolon sheet with decimal commas ("0,4") is not split at the commas;
 * - LF, CRLF and CR line ends are all taken as line ends, even mixed (papaparse alone picks one kind);
 * - a byte-order mark at the start is dropped (our own exports start with one) and blank lines are skipped;
 * - each row keeps the line it starts on, and papaparse's complaints about it (a quote that never closes,
 *   a malformed quote), so a message can point at the row. Nothing is dropped.
 */

export type CsvSeparator = ',' | ';' | '\t' | '|';

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

const GUESS: CsvSeparator[] = ['\t', ';', ',', '|'];

const problemOf = (errors: Papa.ParseError[], line: number): string | undefined => {
  const messages = errors
    .filter((e) => e.type !== 'Delimiter')
    .map((e) =>
      e.code === 'MissingQuotes'
        ? `A quote opened on line ${line} is never closed; the rest of the text was read as one value`
        : e.code === 'InvalidQuotes'
          ? `A quoted value on line ${line} has text after its closing quote`
          : e.message,
    );
  return messages.length === 0 ? undefined : [...new Set(messages)].join('; ') + '.';
};

export function parseCsv(input: string, separator?: CsvSeparator): CsvResult {
  const text = (input.startsWith('\uFEFF') ? input.slice(1) : input).replace(/\r\n?/g, '\n');
  const rows: CsvRow[] = [];
  let start = 0;
  let lineEnds = 0;
  let used: string = separator ?? ',';
  Papa.parse<string[]>(text, {
    ...(separator === undefined ? { delimitersToGuess: GUESS } : { delimiter: separator }),
    newline: '\n',
    step: (result) => {
      used = result.meta.delimiter;
      // The row runs from the previous row's end to the cursor; its line is the count of line ends before.
      const line = 1 + lineEnds;
      lineEnds += countLineEnds(text, start, result.meta.cursor);
      start = result.meta.cursor;
      const fields = result.data.map((f) => f.trim());
      const problem = problemOf(result.errors, line);
      if (fields.length === 1 && fields[0] === '' && problem === undefined) return; // a blank line
      rows.push(problem === undefined ? { line, fields } : { line, fields, problem });
    },
  });
  return { separator: (GUESS as string[]).includes(used) ? (used as CsvSeparator) : ',', rows };
}

function countLineEnds(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i += 1) if (text.charCodeAt(i) === 10) n += 1;
  return n;
}
