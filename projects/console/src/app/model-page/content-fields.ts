import type { Plant, Revision } from '../api/api-types';
import { formatCoefficients, formatNumber, formatRoots, formatSeconds } from '../models/loop-format';

/** What a revision (or the current model) holds: the content a save replaces. */
export type ModelContent = Pick<Revision, 'name' | 'description' | 'tags' | 'plant' | 'compensator' | 'design'>;

/** How a field is compared and shown: word by word (`prose`; `formula` in a fixed-width face), item by item (`list`), or as one value. */
export type FieldKind = 'prose' | 'formula' | 'list' | 'value';

/** The sections of a model's content, in the order they are shown. */
export type FieldGroup = 'Model' | 'Plant' | 'Compensator' | 'Design';

/** One field of a model's content as written for people; `value` null when the content does not have it. */
export interface ContentField {
  /** Stable key ('plant.expression', 'design.gain'): rows of two revisions are matched by it. */
  readonly key: string;
  readonly group: FieldGroup;
  readonly label: string;
  readonly kind: FieldKind;
  readonly value: string | null;
  /** The items of a `list` field (tags). */
  readonly items: readonly string[];
}

function field(key: string, group: FieldGroup, label: string, kind: FieldKind, value: string | null, items: readonly string[] = []): ContentField {
  return { key, group, label, kind, value, items };
}

function plantForm(plant: Plant): string {
  if ('expression' in plant) return 'expression';
  if ('numerator' in plant) return 'coefficients';
  return 'poles and zeros';
}

function plantFields(plant: Plant): ContentField[] {
  const expression = 'expression' in plant ? plant.expression : null;
  const coefficients = 'numerator' in plant ? plant : null;
  const factored = !expression && !coefficients && 'poles' in plant ? plant : null;
  const seconds = (value: number | undefined): string | null => (value === undefined ? null : formatSeconds(value));
  return [
    field('plant.form', 'Plant', 'Written as', 'value', plantForm(plant)),
    field('plant.expression', 'Plant', 'Transfer function', 'formula', expression),
    field('plant.numerator', 'Plant', 'Numerator (highest power first)', 'formula', coefficients ? formatCoefficients(coefficients.numerator) : null),
    field('plant.denominator', 'Plant', 'Denominator (highest power first)', 'formula', coefficients ? formatCoefficients(coefficients.denominator) : null),
    field('plant.gain', 'Plant', 'Plant gain', 'value', factored ? formatNumber(factored.gain ?? 1) : null),
    field('plant.zeros', 'Plant', 'Plant zeros', 'formula', factored ? formatRoots(factored.zeros) : null),
    field('plant.poles', 'Plant', 'Plant poles', 'formula', factored ? formatRoots(factored.poles) : null),
    field('plant.domain', 'Plant', 'Plane', 'value', plant.domain ?? 's'),
    field('plant.sampleTime', 'Plant', 'Sampling period', 'value', seconds(plant.sampleTime)),
    field('plant.deadTime', 'Plant', 'Dead time', 'value', seconds(plant.deadTime)),
    field('plant.padeOrder', 'Plant', 'Padé order', 'value', plant.deadTime && plant.domain !== 'z' && !plant.discretize ? String(plant.padeOrder ?? 3) : null),
    field('plant.discretize', 'Plant', 'Zero-order hold at', 'value', plant.discretize ? formatSeconds(plant.discretize.sampleTime) : null),
  ];
}

/**
 * The content of a model as labelled fields, in a fixed order: name, description and tags; the plant in
 * its own form; the compensator's zeros, poles and gain; the design gain and each design target. The
 * revision view lists them, the revision comparison matches two lists by `key`.
 */
export function contentFields(content: ModelContent): ContentField[] {
  const compensator = content.compensator;
  const targets = content.design.targets;
  const target = (value: number | undefined, unit = ''): string | null => (value === undefined ? null : `${formatNumber(value)}${unit}`);
  return [
    field('name', 'Model', 'Name', 'prose', content.name),
    field('description', 'Model', 'Description', 'prose', content.description || '(none)'),
    field('tags', 'Model', 'Tags', 'list', content.tags.length ? content.tags.join(', ') : '(none)', content.tags),
    ...plantFields(content.plant),
    field('compensator', 'Compensator', 'Compensator', 'value', compensator ? 'in series with the plant' : 'none'),
    field('compensator.zeros', 'Compensator', 'Compensator zeros', 'formula', compensator ? formatRoots(compensator.zeros) : null),
    field('compensator.poles', 'Compensator', 'Compensator poles', 'formula', compensator ? formatRoots(compensator.poles) : null),
    field('compensator.gain', 'Compensator', 'Compensator gain', 'value', compensator ? formatNumber(compensator.gain ?? 1) : null),
    field('design.gain', 'Design', 'Design gain K', 'value', content.design.gain === null ? 'not set' : formatNumber(content.design.gain)),
    field('design.minDampingRatio', 'Design', 'Damping ratio at least', 'value', target(targets?.minDampingRatio)),
    field('design.maxSettlingTime', 'Design', 'Settling time (2 %) at most', 'value', target(targets?.maxSettlingTime, ' s')),
    field('design.maxOvershootPct', 'Design', 'Overshoot at most', 'value', target(targets?.maxOvershootPct, ' %')),
    field('design.naturalFrequency.min', 'Design', 'Natural frequency at least', 'value', target(targets?.naturalFrequency?.min, ' rad/s')),
    field('design.naturalFrequency.max', 'Design', 'Natural frequency at most', 'value', target(targets?.naturalFrequency?.max, ' rad/s')),
  ];
}
