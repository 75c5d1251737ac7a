import { ValidationError } from '@polewright/locus-core';
import { describeError, fieldPath } from './loop-message';

describe('describeError', () => {
  it('names each field of a core ValidationError by its readable path', () => {
    const error = new ValidationError([
      { pointer: '/plant/denominator/0', detail: 'must be a finite number' },
      { pointer: '/plant/domain', detail: 'must be "s" (continuous) or "z" (sampled)' },
    ]);
    expect(describeError(error)).toBe('Model not accepted: plant › denominator › 0 must be a finite number; plant › domain must be "s" (continuous) or "z" (sampled).');
  });

  it('ends a plain error message as a sentence and keeps one that already is', () => {
    expect(describeError(new Error('The model is empty'))).toBe('The model is empty.');
    expect(describeError(new Error('Done.'))).toBe('Done.');
    expect(describeError('odd')).toBe('odd.');
  });

  it('unescapes JSON Pointer segments', () => {
    expect(fieldPath('/a~1b/c~0d')).toBe('a/b › c~d');
    expect(fieldPath('')).toBe('');
  });
});

describe('describeError for targets', () => {
  it('says the targets, not the model, were refused when every field at fault is a target', () => {
    expect(describeError(ValidationError.at('/targets/maxSettlingTime', 'must be positive'))).toBe('Targets not accepted: targets › maxSettlingTime must be positive.');
  });
});
