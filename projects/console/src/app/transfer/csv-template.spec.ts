import { CSV_COLUMNS, csvTemplate } from './csv-template';

describe('csvTemplate', () => {
  it('has every column of the contract in its header and one cell per column in each example row', () => {
    const lines = csvTemplate().trimEnd().split('\r\n');
    expect(lines[0]?.split(',')).toEqual(['name', 'description', 'tags', 'expression', 'numerator', 'denominator', 'domain', 'sampleTime', 'deadTime', 'padeOrder', 'discretizeSampleTime', 'designGain', 'comment']);
    expect(CSV_COLUMNS.map((c) => c.name)).toEqual(lines[0]?.split(','));
    expect(lines).toHaveLength(3);
    // no example cell holds a comma or a quote, so a plain split counts the cells
    for (const row of lines.slice(1)) expect(row.split(',')).toHaveLength(CSV_COLUMNS.length);
  });

  it('gives one example with an expression and one with coefficients and a dead time', () => {
    const [, first, second] = csvTemplate().trimEnd().split('\r\n').map((l) => l.split(','));
    const column = (row: string[] | undefined, name: string) => row?.[CSV_COLUMNS.findIndex((c) => c.name === name)];
    expect(column(first, 'expression')).toMatch(/s/);
    expect(column(second, 'expression')).toBe('');
    expect(column(second, 'denominator')).toMatch(/^[\d. ]+$/);
    expect(Number(column(second, 'deadTime'))).toBeGreaterThan(0);
  });
});
