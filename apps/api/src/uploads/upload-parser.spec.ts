import { MAX_ROWS, decodeText, kindOf, parseTable, parseTuples } from './upload-parser';

describe('upload parser', () => {
  it('reads one integer per line with comments and blank lines', () => {
    const out = parseTuples('# offsets of a 5-tuple\n0\n2\n\n6  # third\n8\n+12\n');
    expect(out).toEqual({ ok: true, content: { kind: 'tuples', values: ['0', '2', '6', '8', '12'] }, rowCount: 5, columns: null });
  });

  it('keeps integers above 2^53 exactly', () => {
    const out = parseTuples('9007199254740993\n');
    expect(out.ok && out.content.kind === 'tuples' && out.content.values).toEqual(['9007199254740993']);
  });

  it('names the line of every bad value', () => {
    const out = parseTuples('0\n2\nsix\n8\n1.5\n');
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors.map((e) => e.line)).toEqual([3, 5]);
  });

  it('refuses a repeated value with the lines of both occurrences (a tuple is a set)', () => {
    const out = parseTuples('# admissible offsets\n0\n2\n6\n+2\n8\n006\n');
    expect(out.ok).toBe(false);
    if (!out.ok) {
      expect(out.errors).toEqual([
        { line: 5, message: '2 appears on lines 3 and 5 (the values of a tuple are distinct)' },
        { line: 7, message: '6 appears on lines 4 and 7 (the values of a tuple are distinct)' },
      ]);
    }
  });

  it('refuses a table with more than MAX_ROWS rows, naming the first row past the limit', () => {
    const out = parseTable('n\n' + '7\n'.repeat(MAX_ROWS + 50));
    expect(out).toEqual({ ok: false, errors: [{ line: MAX_ROWS + 2, message: `more than ${MAX_ROWS} rows` }] });
    expect(parseTable('n\n' + '7\n'.repeat(MAX_ROWS)).ok).toBe(true);
  });

  it('refuses a file without integers', () => {
    expect(parseTuples('# nothing\n\n').ok).toBe(false);
  });

  it('reads a CSV table with a header', () => {
    const out = parseTable('level,max_gap\n13,22\n17,26\n');
    expect(out).toEqual({
      ok: true,
      content: { kind: 'table', columns: ['level', 'max_gap'], rows: [['13', '22'], ['17', '26']] },
      rowCount: 2,
      columns: ['level', 'max_gap'],
    });
  });

  it('names the line of a row with the wrong number of fields', () => {
    const out = parseTable('a,b\n1,2\n3\n4,5\n');
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors).toEqual([{ line: 3, message: '1 fields where the header has 2' }]);
  });

  it('refuses duplicate header names and binary content', () => {
    expect(parseTable('a,a\n1,2\n').ok).toBe(false);
    expect(decodeText(Buffer.from([0x30, 0x00, 0x31]))).toBeNull();
    expect(decodeText(Buffer.from([0xff, 0xfe, 0x41]))).toBeNull();
  });

  it('tells the kind by extension', () => {
    expect(kindOf('pattern.TXT')).toBe('tuples');
    expect(kindOf('t.tuples')).toBe('tuples');
    expect(kindOf('levels.csv')).toBe('table');
    expect(kindOf('x.xlsx')).toBeNull();
  });
});
