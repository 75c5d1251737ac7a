/** One column of the model CSV (`POST /models/import`, openapi/paths/models.yaml). */
export interface CsvColumn {
  readonly name: string;
  readonly meaning: string;
}

/** The columns the import reads, in the contract's order; only `name` and a plant are required. */
export const CSV_COLUMNS: readonly CsvColumn[] = [
  { name: 'name', meaning: 'Required. The model’s name.' },
  { name: 'description', meaning: 'Free text.' },
  { name: 'tags', meaning: 'Separated by ; or spaces.' },
  { name: 'expression', meaning: 'The plant as an expression in s (or z), e.g. 4*(s+2)/(s*(s+5)). Give this, or numerator and denominator.' },
  { name: 'numerator', meaning: 'Coefficients, highest power first, separated by spaces or ;.' },
  { name: 'denominator', meaning: 'Coefficients, highest power first, separated by spaces or ;.' },
  { name: 'domain', meaning: 's (continuous, the default) or z (sampled).' },
  { name: 'sampleTime', meaning: 'Seconds; needed for a z plant.' },
  { name: 'deadTime', meaning: 'Seconds of transport delay (s plants).' },
  { name: 'padeOrder', meaning: '1–10: order of the Padé approximant of the dead time (3 when empty).' },
  { name: 'discretizeSampleTime', meaning: 'Seconds: turn the s plant into its zero-order-hold equivalent at this period.' },
  { name: 'designGain', meaning: 'The loop gain K saved with the model.' },
  { name: 'comment', meaning: 'The first revision’s comment (“Imported from <file>” when empty).' },
];

/** Example rows of the template: invented loops of the demo company, one per plant form. */
const EXAMPLE_ROWS: readonly Record<string, string>[] = [
  {
    name: 'Parcel sorter divert arm (example)',
    description: 'Position loop of a divert arm on the parcel sorter: motor lag and an integrator.',
    tags: 'sorter;position;example',
    expression: '6.5/(s*(s+4.2)*(s+11))',
    designGain: '8',
    comment: 'From the CSV template',
  },
  {
    name: 'Glue pot temperature (example)',
    description: 'Heater and pot lag with 2 s of transport delay (given as coefficients).',
    tags: 'temperature;dead-time;example',
    numerator: '0.9',
    denominator: '45 16 1',
    deadTime: '2',
    padeOrder: '2',
    designGain: '1.2',
  },
];

/** Quotes a CSV cell when it holds a comma, a quote or a line break (RFC 4180). */
function cell(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** The CSV template: every column in the header, then the example rows. */
export function csvTemplate(): string {
  const header = CSV_COLUMNS.map((c) => c.name);
  const rows = EXAMPLE_ROWS.map((row) => header.map((name) => cell(row[name] ?? '')).join(','));
  return `${[header.join(','), ...rows].join('\r\n')}\r\n`;
}
