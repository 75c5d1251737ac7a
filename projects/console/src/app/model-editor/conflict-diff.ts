import { diffWords, type Change } from 'diff';
import { formatNumber } from './coefficients';
import type { EditorValue } from './editor-form';
import { complexText, type ComplexEntry, hasDeadTime, type PlantFields, plantOf, usesPade } from './plant-body';

/** The fields a conflict is shown by (one row each). */
export type DiffField = 'name' | 'description' | 'tags' | 'plant' | 'domain' | 'sampleTime' | 'deadTime' | 'padeOrder' | 'discretize';

/** One field on which their saved revision and your edits differ. */
export interface FieldDiff {
  readonly field: DiffField;
  readonly label: string;
  /** Their saved value, as text. */
  readonly theirs: string;
  /** Your value, as text. */
  readonly mine: string;
  /** Word-level changes from theirs to yours (the `diff` package). */
  readonly changes: readonly Change[];
  /** Whether you changed the field since the revision you started from. */
  readonly changedByMe: boolean;
  /** Whether they changed it since that revision. */
  readonly changedByThem: boolean;
}

const LABELS: Record<DiffField, string> = {
  name: 'Name',
  description: 'Description',
  tags: 'Tags',
  plant: 'Plant',
  domain: 'Domain',
  sampleTime: 'Sampling period',
  deadTime: 'Dead time',
  padeOrder: 'Padé order',
  discretize: 'Zero-order hold',
};

/** The fields in display order. */
export const DIFF_FIELDS = Object.keys(LABELS) as DiffField[];

/**
 * Field by field, where their saved revision and your edits differ, with who changed what since the
 * revision you started from (`base`). Fields that agree are left out.
 */
export function fieldDiffs(base: EditorValue, theirs: EditorValue, mine: EditorValue): FieldDiff[] {
  const b = describe(base);
  const t = describe(theirs);
  const m = describe(mine);
  const diffs: FieldDiff[] = [];
  for (const field of DIFF_FIELDS) {
    if (t[field].key === m[field].key) continue;
    diffs.push({
      field,
      label: LABELS[field],
      theirs: t[field].text,
      mine: m[field].text,
      changes: diffWords(t[field].text, m[field].text),
      changedByMe: m[field].key !== b[field].key,
      changedByThem: t[field].key !== b[field].key,
    });
  }
  return diffs;
}

/** Each field of a value: `text` to show, `key` to compare (what a save would send, where it can be read). */
function describe(value: EditorValue): Record<DiffField, { text: string; key: string }> {
  const p = value.plant;
  const same = (text: string): { text: string; key: string } => ({ text, key: text });
  const body = plantOf(p);
  return {
    name: same(value.name.trim()),
    description: same(value.description.trim()),
    tags: same(value.tags.length ? value.tags.join(', ') : '(none)'),
    plant: { text: plantText(p), key: body === null ? `unreadable:${plantText(p)}` : JSON.stringify(formPart(body as Record<string, unknown>)) },
    domain: same(p.domain === 'z' ? 'z (sampled)' : 's (continuous)'),
    sampleTime: same(p.domain === 'z' ? seconds(p.sampleTime) : '(none)'),
    deadTime: same(hasDeadTime(p) ? seconds(p.deadTime) : '(none)'),
    padeOrder: same(usesPade(p) ? String(p.padeOrder) : '(not used)'),
    discretize: same(p.domain === 's' && p.discretize.enabled ? `at ${seconds(p.discretize.sampleTime)}` : 'off'),
  };
}

/** The plant's transfer function as the editor shows it in a conflict. */
export function plantText(p: PlantFields): string {
  if (p.form === 'expression') return p.expression.trim() || '(empty)';
  if (p.form === 'coefficients') return `numerator ${p.numerator.trim() || '(empty)'} / denominator ${p.denominator.trim() || '(empty)'}`;
  return `zeros ${list(p.zeros)}; poles ${list(p.poles)}; gain ${p.gain === null ? '(empty)' : formatNumber(p.gain)}`;
}

function formPart(body: Record<string, unknown>): Record<string, unknown> {
  const { expression, numerator, denominator, zeros, poles, gain } = body;
  return { expression, numerator, denominator, zeros, poles, gain };
}

function list(entries: readonly ComplexEntry[]): string {
  return entries.length ? entries.map((e) => (e.re === null ? '?' : complexText(e))).join(', ') : '(none)';
}

function seconds(value: number | null): string {
  return value === null ? '(empty)' : `${formatNumber(value)} s`;
}
