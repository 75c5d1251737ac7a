import { parse } from 'csv-parse/sync';
import { InputError } from '../http/errors.js';

/** Columns a model CSV may have (header row, any order). */
export const CSV_COLUMNS = [
  'name', 'description', 'tags', 'expression', 'numerator', 'denominator', 'domain', 'sampleTime', 'deadTime', 'padeOrder', 'discretizeSampleTime', 'designGain', 'comment',
] as const;

type Column = (typeof CSV_COLUMNS)[number];

/** One data row of the CSV as the model body it describes (1-based `row`, header excluded). */
export interface CsvRow {
  readonly row: number;
  readonly body: Record<string, unknown>;
}

/**
 * Parses a model CSV (csv-parse) into model bodies. Numbers that do not parse become NaN so that the
 * engine's own check names the field; list cells (tags, coefficients) are split on `;` or whitespace.
 * Throws `InputError` (pointer `/file`) when the file itself is not a usable CSV.
 */
export function readModelCsv(text: string): CsvRow[] {
  let records: Record<string, string>[];
  try {
    records = parse(text, { columns: (header: string[]) => header.map((h) => h.trim()), skip_empty_lines: true, trim: true, bom: true }) as Record<string, string>[];
  } catch (error) {
    throw InputError.at('/file', `is not a readable CSV file: ${error instanceof Error ? error.message : String(error)}`);
  }
  if (records.length === 0) return [];
  const header = Object.keys(records[0]);
  const unknown = header.filter((h) => !(CSV_COLUMNS as readonly string[]).includes(h));
  if (unknown.length) throw InputError.at('/file', `has unknown column(s) ${unknown.join(', ')}; the columns are ${CSV_COLUMNS.join(', ')}`);
  if (!header.includes('name')) throw InputError.at('/file', 'has no "name" column');
  if (!header.includes('expression') && !(header.includes('numerator') && header.includes('denominator'))) {
    throw InputError.at('/file', 'needs an "expression" column or both "numerator" and "denominator"');
  }
  return records.map((record, i) => ({ row: i + 1, body: toBody(record as Partial<Record<Column, string>>) }));
}

function toBody(cell: Partial<Record<Column, string>>): Record<string, unknown> {
  const present = (c: Column): boolean => cell[c] !== undefined && cell[c] !== '';
  const plant: Record<string, unknown> = {};
  if (present('expression')) plant['expression'] = cell.expression;
  else if (present('numerator') || present('denominator')) {
    plant['numerator'] = numbers(cell.numerator);
    plant['denominator'] = numbers(cell.denominator);
  }
  if (present('domain')) plant['domain'] = cell.domain;
  if (present('sampleTime')) plant['sampleTime'] = Number(cell.sampleTime);
  if (present('deadTime')) plant['deadTime'] = Number(cell.deadTime);
  if (present('padeOrder')) plant['padeOrder'] = Number(cell.padeOrder);
  if (present('discretizeSampleTime')) plant['discretize'] = { sampleTime: Number(cell.discretizeSampleTime) };
  const body: Record<string, unknown> = {
    name: cell.name ?? '',
    description: cell.description ?? '',
    tags: (cell.tags ?? '').split(/[;\s]+/).filter(Boolean),
    plant: Object.keys(plant).length ? plant : undefined,
    compensator: null,
    design: { gain: present('designGain') ? Number(cell.designGain) : null, targets: null },
  };
  if (present('comment')) body['comment'] = cell.comment;
  return body;
}

function numbers(cell: string | undefined): number[] {
  return (cell ?? '').split(/[;\s]+/).filter(Boolean).map(Number);
}
