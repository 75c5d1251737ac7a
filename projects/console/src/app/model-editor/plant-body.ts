import type { Complex, Plant } from '../api/api-types';
import { formatCoefficients, formatNumber, parseCoefficients } from './coefficients';

/** The three ways the editor takes a plant. */
export type PlantFormKind = 'expression' | 'coefficients' | 'factored';

/** One pole or zero as typed: real and imaginary part (null while empty or not a number). */
export interface ComplexEntry {
  readonly re: number | null;
  readonly im: number | null;
}

/** The plant part of the editor's form, as typed (every form's fields are kept; `form` says which one counts). */
export interface PlantFields {
  readonly form: PlantFormKind;
  readonly expression: string;
  readonly numerator: string;
  readonly denominator: string;
  readonly zeros: readonly ComplexEntry[];
  readonly poles: readonly ComplexEntry[];
  readonly gain: number | null;
  readonly domain: 's' | 'z';
  readonly sampleTime: number | null;
  readonly deadTime: number | null;
  readonly padeOrder: number | null;
  readonly discretize: { readonly enabled: boolean; readonly sampleTime: number | null };
}

/** The default Padé order of the engine (`DEFAULT_PADE_ORDER`), shown in the field when none is stored. */
export const DEFAULT_PADE = 3;

/** An empty plant: expression form, continuous time, no dead time. */
export function emptyPlantFields(): PlantFields {
  return {
    form: 'expression',
    expression: '',
    numerator: '',
    denominator: '',
    zeros: [],
    poles: [],
    gain: 1,
    domain: 's',
    sampleTime: null,
    deadTime: null,
    padeOrder: DEFAULT_PADE,
    discretize: { enabled: false, sampleTime: null },
  };
}

/** The variable of the plant's expression and polynomials: `z` for a sampled plant, else `s` (also when discretised). */
export function variableOf(fields: Pick<PlantFields, 'domain'>): 's' | 'z' {
  return fields.domain === 'z' ? 'z' : 's';
}

/** Whether the dead time takes part (a positive number). */
export function hasDeadTime(fields: Pick<PlantFields, 'deadTime'>): boolean {
  return typeof fields.deadTime === 'number' && fields.deadTime > 0;
}

/** Whether the Padé order takes part: a continuous plant with dead time that is not discretised (the hold treats dead time exactly). */
export function usesPade(fields: Pick<PlantFields, 'domain' | 'deadTime' | 'discretize'>): boolean {
  return fields.domain === 's' && !fields.discretize.enabled && hasDeadTime(fields);
}

/**
 * The `plant` body of a save (the core's plant form) for what the form holds, or null while the active
 * form's own fields cannot be read (coefficient text that is not numbers, an empty pole). Only the fields
 * that take part are sent: `domain` only for sampled plants, `padeOrder` only with dead time, `discretize`
 * only when chosen.
 * Example: plantOf({ form: 'coefficients', numerator: '2', denominator: '1 3 0', domain: 's', … }) = { numerator: [2], denominator: [1, 3, 0] }.
 */
export function plantOf(fields: PlantFields): Plant | null {
  const body: Record<string, unknown> = {};
  if (fields.form === 'expression') {
    body['expression'] = fields.expression.trim();
  } else if (fields.form === 'coefficients') {
    const numerator = parseCoefficients(fields.numerator).values;
    const denominator = parseCoefficients(fields.denominator).values;
    if (numerator === null || denominator === null) return null;
    body['numerator'] = numerator;
    body['denominator'] = denominator;
  } else {
    const zeros = complexList(fields.zeros);
    const poles = complexList(fields.poles);
    if (zeros === null || poles === null || fields.gain === null) return null;
    body['zeros'] = zeros;
    body['poles'] = poles;
    body['gain'] = fields.gain;
  }
  if (fields.domain === 'z') {
    body['domain'] = 'z';
    body['sampleTime'] = fields.sampleTime;
  }
  if (hasDeadTime(fields)) body['deadTime'] = fields.deadTime;
  if (usesPade(fields)) body['padeOrder'] = fields.padeOrder;
  if (fields.domain === 's' && fields.discretize.enabled) body['discretize'] = { sampleTime: fields.discretize.sampleTime };
  return body as Plant;
}

/** The form's fields for a stored plant (any of the three forms); what a form does not use keeps its default. */
export function plantFieldsOf(plant: Plant): PlantFields {
  const source = plant as Record<string, unknown>;
  const fields = { ...emptyPlantFields() } as { -readonly [K in keyof PlantFields]: PlantFields[K] };
  if (typeof source['expression'] === 'string') {
    fields.form = 'expression';
    fields.expression = source['expression'];
  } else if (Array.isArray(source['numerator']) || Array.isArray(source['denominator'])) {
    fields.form = 'coefficients';
    fields.numerator = formatCoefficients((source['numerator'] as number[] | undefined) ?? []);
    fields.denominator = formatCoefficients((source['denominator'] as number[] | undefined) ?? []);
  } else {
    fields.form = 'factored';
    fields.zeros = entriesOf(source['zeros']);
    fields.poles = entriesOf(source['poles']);
    fields.gain = typeof source['gain'] === 'number' ? source['gain'] : 1;
  }
  fields.domain = source['domain'] === 'z' ? 'z' : 's';
  fields.sampleTime = typeof source['sampleTime'] === 'number' ? source['sampleTime'] : null;
  fields.deadTime = typeof source['deadTime'] === 'number' ? source['deadTime'] : null;
  fields.padeOrder = typeof source['padeOrder'] === 'number' ? source['padeOrder'] : DEFAULT_PADE;
  const discretize = source['discretize'] as { sampleTime?: unknown } | undefined;
  fields.discretize = typeof discretize?.sampleTime === 'number' ? { enabled: true, sampleTime: discretize.sampleTime } : { enabled: false, sampleTime: null };
  return fields;
}

/** A complex number as the editor writes it. Example: complexText({ re: -1, im: -2 }) = '−1 − 2j'. */
export function complexText(value: ComplexEntry): string {
  const re = value.re ?? 0;
  const im = value.im ?? 0;
  if (im === 0) return signed(re);
  if (re === 0) return `${signed(im)}j`;
  return `${signed(re)} ${im < 0 ? '−' : '+'} ${formatNumber(Math.abs(im))}j`;
}

function signed(value: number): string {
  return value < 0 ? `−${formatNumber(-value)}` : formatNumber(value);
}

function complexList(entries: readonly ComplexEntry[]): Complex[] | null {
  const out: Complex[] = [];
  for (const entry of entries) {
    if (entry.re === null || !Number.isFinite(entry.re)) return null;
    if (entry.im !== null && !Number.isFinite(entry.im)) return null;
    out.push({ re: entry.re, im: entry.im ?? 0 });
  }
  return out;
}

function entriesOf(value: unknown): ComplexEntry[] {
  if (!Array.isArray(value)) return [];
  return value.map((v: { re?: unknown; im?: unknown }) => ({ re: typeof v?.re === 'number' ? v.re : null, im: typeof v?.im === 'number' ? v.im : 0 }));
}
