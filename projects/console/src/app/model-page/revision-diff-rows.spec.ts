import { aRevision } from '../models/model-fixtures';
import { ABSENT, type DiffRow, diffRows, jsonDiff } from './revision-diff-rows';

function row(rows: DiffRow[], key: string): DiffRow {
  const found = rows.find((r) => r.key === key);
  if (!found) throw new Error(`no row ${key}`);
  return found;
}

function marked(parts: DiffRow['beforeParts'], change: 'added' | 'removed'): string[] {
  return parts.filter((p) => p.change === change).map((p) => p.text);
}

describe('revision comparison rows', () => {
  it('marks nothing as changed between two revisions with the same content', () => {
    const rows = diffRows(aRevision(1), aRevision(2));
    expect(rows.filter((r) => r.changed)).toEqual([]);
    expect(rows.map((r) => r.key)).toEqual([
      'name', 'description', 'tags', 'plant.form', 'plant.expression', 'plant.domain',
      'compensator', 'design.gain',
    ]);
  });

  it('marks the words of a changed plant expression that were replaced', () => {
    const before = aRevision(1, { plant: { expression: '9.5*(s+1.5)/(s*(s+0.9))' } });
    const after = aRevision(2, { plant: { expression: '9.5*(s+2)/(s*(s+0.9))' } });
    const expression = row(diffRows(before, after), 'plant.expression');
    expect(expression.changed).toBe(true);
    expect(expression.kind).toBe('formula');
    expect(marked(expression.beforeParts, 'removed')).toEqual(['1.5']);
    expect(marked(expression.afterParts, 'added')).toEqual(['2']);
    expect(expression.afterParts.map((p) => p.text).join('')).toBe('9.5*(s+2)/(s*(s+0.9))');
  });

  it('shows an added compensator as changed zeros, poles and gain', () => {
    const before = aRevision(1);
    const after = aRevision(2, { compensator: { zeros: [{ re: -2, im: 0 }], poles: [{ re: -10, im: 0 }, { re: -1, im: 3 }, { re: -1, im: -3 }], gain: 2.5 } });
    const rows = diffRows(before, after);
    expect(row(rows, 'compensator')).toMatchObject({ changed: true, before: 'none', after: 'in series with the plant' });
    expect(row(rows, 'compensator.zeros')).toMatchObject({ changed: true, before: ABSENT, after: '-2' });
    expect(row(rows, 'compensator.poles')).toMatchObject({ changed: true, after: '-10, -1 ± 3j' });
    expect(row(rows, 'compensator.gain')).toMatchObject({ changed: true, before: ABSENT, after: '2.5' });
    expect(row(rows, 'plant.expression').changed).toBe(false);
  });

  it('compares a compensator pole that moved word by word', () => {
    const before = aRevision(1, { compensator: { zeros: [{ re: -2 }], poles: [{ re: -10 }], gain: 1 } });
    const after = aRevision(2, { compensator: { zeros: [{ re: -2 }], poles: [{ re: -12 }], gain: 1 } });
    const poles = row(diffRows(before, after), 'compensator.poles');
    expect(marked(poles.beforeParts, 'removed')).toEqual(['10']);
    expect(marked(poles.afterParts, 'added')).toEqual(['12']);
    expect(row(diffRows(before, after), 'compensator.zeros').changed).toBe(false);
  });

  it('shows a changed design gain and a new target as whole values, the missing side as a dash', () => {
    const before = aRevision(1, { design: { gain: 8.08, targets: null } });
    const after = aRevision(2, { design: { gain: 2.46, targets: { minDampingRatio: 0.4 } } });
    const rows = diffRows(before, after);
    expect(row(rows, 'design.gain')).toMatchObject({ changed: true, before: '8.08', after: '2.46', beforeParts: [{ text: '8.08', change: 'removed' }], afterParts: [{ text: '2.46', change: 'added' }] });
    expect(row(rows, 'design.minDampingRatio')).toMatchObject({ changed: true, before: ABSENT, after: '0.4' });
    expect(rows.some((r) => r.key === 'design.maxSettlingTime')).toBe(false);
  });

  it('compares tags item by item', () => {
    const tags = row(diffRows(aRevision(1, { tags: ['hvac', 'dead-time'] }), aRevision(2, { tags: ['hvac', 'dead-time', 'retuned'] })), 'tags');
    expect(tags.changed).toBe(true);
    expect(tags.beforeParts).toEqual([{ text: 'hvac', change: 'same' }, { text: 'dead-time', change: 'same' }]);
    expect(marked(tags.afterParts, 'added')).toEqual(['retuned']);
  });

  it('lines up plants written in different forms, each field present on one side only', () => {
    const rows = diffRows(aRevision(1, { plant: { expression: '4/(s*(s+2))' } }), aRevision(2, { plant: { numerator: [4], denominator: [1, 2, 0] } }));
    expect(row(rows, 'plant.form')).toMatchObject({ before: 'expression', after: 'coefficients', changed: true });
    expect(row(rows, 'plant.expression')).toMatchObject({ after: ABSENT, changed: true });
    expect(row(rows, 'plant.denominator')).toMatchObject({ before: ABSENT, after: '[1, 2, 0]', changed: true });
  });

  it('lists the stored loop line by line with the changed lines marked', () => {
    const lines = jsonDiff(aRevision(1, { plant: { expression: '1/(s+1)' } }), aRevision(2, { plant: { expression: '1/(s+2)' } }));
    expect(lines.filter((l) => l.change === 'removed').map((l) => l.text.trim())).toEqual(['"expression": "1/(s+1)"']);
    expect(lines.filter((l) => l.change === 'added').map((l) => l.text.trim())).toEqual(['"expression": "1/(s+2)"']);
    expect(lines.some((l) => l.change === 'same' && l.text.includes('"compensator": null'))).toBe(true);
  });
});
