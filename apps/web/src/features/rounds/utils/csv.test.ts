import { parseCsv } from '@/features/rounds/utils/csv';

describe('parseCsv (papaparse, with line numbers)', () => {
  it('reads comma-separated rows with a header', () => {
    const { separator, rows } = parseCsv('orientation,kind\n130/50,joint\n045/80,fault\n');
    expect(separator).toBe(',');
    expect(rows.map((r) => r.fields)).toEqual([
      ['orientation', 'kind'],
      ['130/50', 'joint'],
      ['045/80', 'fault'],
    ]);
  });

  it('guesses the separator: semicolons with decimal commas, tabs (a spreadsheet copy), quoted separators', () => {
    expect(parseCsv('a;b;c\n1,5;2;3').separator).toBe(';');
    expect(parseCsv('a\tb\tc\n1\t2\t3').separator).toBe('\t');
    expect(parseCsv('"a;b",c\n"1;2",3').separator).toBe(',');
    expect(parseCsv('dip direction;dip\n130;50,5').rows.map((r) => r.fields)).toEqual([
      ['dip direction', 'dip'],
      ['130', '50,5'],
    ]);
    expect(parseCsv('orientation;spacing\n130/50;0,4').rows[1].fields).toEqual(['130/50', '0,4']);
    expect(parseCsv('orientation\tkind\nN30E 40SE\tbedding').rows[1].fields).toEqual([
      'N30E 40SE',
      'bedding',
    ]);
  });

  it('reads quoted fields holding separators, doubled quotes and line breaks', () => {
    const { rows } = parseCsv(
      'notes,orientation\n"wet, slickensided","130/50"\n"says ""open""",1\n"two\nlines",2',
    );
    expect(rows[1].fields).toEqual(['wet, slickensided', '130/50']);
    expect(rows[2].fields).toEqual(['says "open"', '1']);
    expect(rows[3].fields).toEqual(['two\nlines', '2']);
    expect(rows[3].line).toBe(4);
  });

  it('handles CRLF, CR, a byte-order mark, blank lines and surrounding spaces', () => {
    const { rows } = parseCsv('\uFEFForientation, kind\r\n\r\n 130/50 , joint\r045/80,fault');
    expect(rows.map((r) => r.fields)).toEqual([
      ['orientation', 'kind'],
      ['130/50', 'joint'],
      ['045/80', 'fault'],
    ]);
    expect(rows.map((r) => r.line)).toEqual([1, 3, 4]);
  });

  it('keeps an empty last field and empty quoted values', () => {
    expect(parseCsv('a,b,\n"",x,').rows.map((r) => r.fields)).toEqual([
      ['a', 'b', ''],
      ['', 'x', ''],
    ]);
  });

  it('reports a quote that never closes instead of dropping the text', () => {
    const { rows } = parseCsv('orientation,notes\n130/50,"open quote\n045/80,fault');
    expect(rows).toHaveLength(2);
    expect(rows[1].problem).toMatch(/quote opened on line 2 is never closed/);
    expect(rows[1].fields[1]).toBe('open quote\n045/80,fault');
  });

  it('reads nothing from empty text', () => {
    expect(parseCsv('').rows).toEqual([]);
    expect(parseCsv('\n\n').rows).toEqual([]);
  });
});
