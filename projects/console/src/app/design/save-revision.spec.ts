import type { Model } from '../api/api-types';
import { compensatorText, revisionBody, revisionChanges, targetsText } from './save-revision';

const BASE: Model = {
  id: 'm1',
  name: 'Line 3 belt speed',
  description: 'Speed loop of the main belt drive.',
  tags: ['conveyor', 'speed'],
  plant: { expression: '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))' },
  compensator: null,
  design: { gain: 8.35, targets: null },
  revision: 4,
  createdAt: '2026-12-01T09:00:00.000Z',
  updatedAt: '2026-12-01T10:00:00.000Z',
  createdBy: null,
  updatedBy: null,
  deletedAt: null,
};

describe('revisionBody', () => {
  it('keeps name, description, tags and plant, and replaces compensator and design with the edits', () => {
    const body = revisionBody(BASE, { compensator: { zeros: [{ re: -4, im: 0 }], poles: [{ re: -40, im: 0 }], gain: 1 }, gain: 5.5, targets: { maxSettlingTime: 6 } }, '  Lead for faster settling ');
    expect(body).toEqual({
      name: 'Line 3 belt speed',
      description: 'Speed loop of the main belt drive.',
      tags: ['conveyor', 'speed'],
      plant: BASE.plant,
      compensator: { zeros: [{ re: -4, im: 0 }], poles: [{ re: -40, im: 0 }], gain: 1 },
      design: { gain: 5.5, targets: { maxSettlingTime: 6 } },
      comment: 'Lead for faster settling',
    });
  });
});

describe('revisionChanges', () => {
  it('lists what a later revision changed, in words', () => {
    const later: Model = { ...BASE, revision: 5, plant: { expression: '9.5*(s+1.5)/(s*(s+0.7)*(s^2+3.2*s+52))' }, design: { gain: 6, targets: { minDampingRatio: 0.4 } } };
    expect(revisionChanges(BASE, later)).toEqual(['the plant', 'the design gain (K = 8.35 → 6)', 'the targets (now ζ ≥ 0.4)']);
    expect(revisionChanges(BASE, { ...BASE, revision: 5 })).toEqual([]);
  });
});

describe('compensatorText and targetsText', () => {
  it('write the saved content in one line', () => {
    expect(compensatorText(null)).toBe('none (the plant alone)');
    expect(compensatorText({ zeros: [{ re: -1, im: 2 }, { re: -1, im: -2 }], poles: [], gain: 2 })).toBe('zeros −1 ± 2j; poles none; gain 2');
    expect(targetsText({ minDampingRatio: 0.5, naturalFrequency: { min: 1, max: 8 } })).toBe('ζ ≥ 0.5, ωn ≥ 1 rad/s, ωn ≤ 8 rad/s');
    expect(targetsText(null)).toBe('none');
  });
});
