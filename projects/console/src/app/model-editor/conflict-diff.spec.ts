import { fieldDiffs } from './conflict-diff';
import type { EditorValue } from './editor-form';
import { emptyPlantFields, type PlantFields } from './plant-body';

function value(change: Partial<Omit<EditorValue, 'plant'>> & { plant?: Partial<PlantFields> } = {}): EditorValue {
  return { name: 'Tail take-up', description: 'Take-up loop.', tags: ['tension'], ...change, plant: { ...emptyPlantFields(), expression: '3.2/(s*(s+0.8))', ...change.plant } };
}

describe('fieldDiffs', () => {
  it('lists only fields where their revision and the edits differ, and who changed each', () => {
    const base = value();
    const theirs = value({ description: 'Take-up loop, new motor.', tags: ['tension', 'retuned'] });
    const mine = value({ name: 'Tail take-up (heavier roll)', description: 'Take-up loop.', plant: { expression: '3.2/(s*(s+1.1))' } });
    const diffs = fieldDiffs(base, theirs, mine);
    expect(diffs.map((d) => [d.field, d.changedByMe, d.changedByThem])).toEqual([
      ['name', true, false],
      ['description', false, true],
      ['tags', false, true],
      ['plant', true, false],
    ]);
    expect(diffs[2]).toMatchObject({ theirs: 'tension, retuned', mine: 'tension' });
  });

  it('marks a field both sides changed', () => {
    const diffs = fieldDiffs(value(), value({ name: 'A' }), value({ name: 'B' }));
    expect(diffs).toEqual([expect.objectContaining({ field: 'name', changedByMe: true, changedByThem: true })]);
  });

  it('gives word-level changes from theirs to mine (the diff package)', () => {
    const [diff] = fieldDiffs(value(), value({ description: 'Belt take-up loop on line 3.' }), value({ description: 'Belt take-up loop on line 4.' }));
    expect(diff.changes.filter((c) => c.removed).map((c) => c.value.trim())).toEqual(['3']);
    expect(diff.changes.filter((c) => c.added).map((c) => c.value.trim())).toEqual(['4']);
  });

  it('compares plants by what a save would send, so the same plant typed differently is no difference', () => {
    const coefficients = (numerator: string) => value({ plant: { form: 'coefficients', numerator, denominator: '1 0.8 0' } });
    expect(fieldDiffs(coefficients('3.2'), coefficients('3.2'), coefficients(' 3.2 '))).toEqual([]);
    expect(fieldDiffs(coefficients('3.2'), coefficients('3.2'), coefficients('3.3')).map((d) => d.field)).toEqual(['plant']);
  });

  it('shows the time base fields that take part, and ignores a Padé order that does not', () => {
    const theirs = value({ plant: { deadTime: 0.4, padeOrder: 3 } });
    const mine = value({ plant: { deadTime: 0.4, padeOrder: 5 } });
    expect(fieldDiffs(value(), theirs, mine)).toEqual([expect.objectContaining({ field: 'padeOrder', theirs: '3', mine: '5' })]);
    expect(fieldDiffs(value(), value({ plant: { padeOrder: 2 } }), value({ plant: { padeOrder: 5 } }))).toEqual([]);
    const held = fieldDiffs(value(), value(), value({ plant: { discretize: { enabled: true, sampleTime: 0.1 } } }));
    expect(held).toEqual([expect.objectContaining({ field: 'discretize', theirs: 'off', mine: 'at 0.1 s' })]);
  });
});
