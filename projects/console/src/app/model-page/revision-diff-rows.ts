import { diffArrays, diffLines, diffWords } from 'diff';
import { type ContentField, contentFields, type FieldGroup, type FieldKind, type ModelContent } from './content-fields';

/** A piece of a compared value: kept, only in the newer side (`added`) or only in the older one (`removed`). */
export interface DiffPart {
  readonly text: string;
  readonly change: 'same' | 'added' | 'removed';
}

/** One field of two revisions side by side. */
export interface DiffRow {
  readonly key: string;
  readonly group: FieldGroup;
  readonly label: string;
  readonly kind: FieldKind;
  /** The field as written in each revision ('—' where that revision does not have it). */
  readonly before: string;
  readonly after: string;
  readonly changed: boolean;
  /** The left value in pieces, what the right one dropped marked `removed`. */
  readonly beforeParts: readonly DiffPart[];
  /** The right value in pieces, what it added marked `added`. */
  readonly afterParts: readonly DiffPart[];
}

/** What a side without the field shows. */
export const ABSENT = '—';

function parts(kind: FieldKind, a: ContentField | undefined, b: ContentField | undefined): [DiffPart[], DiffPart[]] {
  const before = a?.value ?? ABSENT;
  const after = b?.value ?? ABSENT;
  if (kind === 'list' && a?.items.length && b?.items.length) {
    const left: DiffPart[] = [];
    const right: DiffPart[] = [];
    for (const change of diffArrays([...a.items], [...b.items])) {
      for (const item of change.value) {
        if (!change.added) left.push({ text: item, change: change.removed ? 'removed' : 'same' });
        if (!change.removed) right.push({ text: item, change: change.added ? 'added' : 'same' });
      }
    }
    return [left, right];
  }
  if (before === after) return [[{ text: before, change: 'same' }], [{ text: after, change: 'same' }]];
  if ((kind === 'prose' || kind === 'formula') && a?.value != null && b?.value != null) {
    const left: DiffPart[] = [];
    const right: DiffPart[] = [];
    for (const change of diffWords(before, after)) {
      if (!change.added) left.push({ text: change.value, change: change.removed ? 'removed' : 'same' });
      if (!change.removed) right.push({ text: change.value, change: change.added ? 'added' : 'same' });
    }
    return [left, right];
  }
  // a number, a choice, or a field one side lacks: the whole value changed
  return [[{ text: before, change: 'removed' }], [{ text: after, change: 'added' }]];
}

/**
 * The field-by-field comparison of two revisions: every field either revision has, in content order,
 * each marked changed or not; prose and formulas are compared word by word and tags item by item (the `diff`
 * package), numbers and choices as whole values.
 */
export function diffRows(before: ModelContent, after: ModelContent): DiffRow[] {
  const left = contentFields(before);
  const right = new Map(contentFields(after).map((f) => [f.key, f]));
  const rows: DiffRow[] = [];
  for (const a of left) {
    const b = right.get(a.key);
    if (a.value === null && (b?.value ?? null) === null) continue;
    const [beforeParts, afterParts] = parts(a.kind, a.value === null ? undefined : a, b?.value == null ? undefined : b);
    const beforeText = a.value ?? ABSENT;
    const afterText = b?.value ?? ABSENT;
    rows.push({ key: a.key, group: a.group, label: a.label, kind: a.kind, before: beforeText, after: afterText, changed: beforeText !== afterText, beforeParts, afterParts });
  }
  return rows;
}

/** One line of the JSON comparison. */
export interface JsonLine {
  readonly text: string;
  readonly change: 'same' | 'added' | 'removed';
}

/** The loop (plant and compensator) of a revision as the API stores it, pretty-printed. */
export function loopJson(content: ModelContent): string {
  return `${JSON.stringify({ plant: content.plant, compensator: content.compensator }, null, 2)}\n`;
}

/** The stored plant and compensator of two revisions compared line by line (`diffLines`), as one listing. */
export function jsonDiff(before: ModelContent, after: ModelContent): JsonLine[] {
  const lines: JsonLine[] = [];
  for (const change of diffLines(loopJson(before), loopJson(after))) {
    const kind = change.added ? 'added' : change.removed ? 'removed' : 'same';
    for (const line of change.value.replace(/\n$/, '').split('\n')) lines.push({ text: line, change: kind });
  }
  return lines;
}
