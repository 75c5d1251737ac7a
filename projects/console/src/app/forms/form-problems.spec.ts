import { FormControl, FormGroup, Validators } from '@angular/forms';
import { ApiProblem } from '../problem/api-problem';
import { fieldMessage } from './field-message';
import { showProblemOnForm } from './form-problems';

function modelForm(): FormGroup {
  return new FormGroup({
    name: new FormControl('Belt', Validators.required),
    plant: new FormGroup({ expression: new FormControl('1/(s+1') }),
  });
}

describe('showProblemOnForm', () => {
  it('puts each pointer’s message on its control and marks it touched', () => {
    const form = modelForm();
    const unplaced = showProblemOnForm(form, new ApiProblem(400, 'Invalid request', 'see errors', [{ pointer: '/plant/expression', detail: 'unbalanced parenthesis at 6' }]));
    const expression = form.get(['plant', 'expression'])!;
    expect(unplaced).toEqual([]);
    expect(expression.errors).toEqual({ server: 'unbalanced parenthesis at 6' });
    expect(expression.touched).toBe(true);
    expect(fieldMessage(expression.errors)).toBe('unbalanced parenthesis at 6');
    expect(form.get('name')!.errors).toBeNull();
  });

  it('returns the errors no control can take', () => {
    const form = modelForm();
    const unplaced = showProblemOnForm(form, new ApiProblem(400, 'Invalid request', '', [{ pointer: '/compensator/zeros/0', detail: 'needs its conjugate' }, { pointer: '', detail: 'whole body' }]));
    expect(unplaced.map((e) => e.pointer)).toEqual(['/compensator/zeros/0', '']);
  });

  it('lets the next edit clear the server’s message (validators run again)', () => {
    const form = modelForm();
    showProblemOnForm(form, new ApiProblem(400, 'Invalid request', '', [{ pointer: '/name', detail: 'taken' }]));
    expect(form.get('name')!.errors).toEqual({ server: 'taken' });
    form.get('name')!.setValue('Belt 2');
    expect(form.get('name')!.errors).toBeNull();
  });

  it('decodes ~1 and ~0 in pointer segments (RFC 6901)', () => {
    const form = new FormGroup({ 'a/b': new FormControl(''), 'c~d': new FormControl('') });
    showProblemOnForm(form, new ApiProblem(400, 't', '', [{ pointer: '/a~1b', detail: 'one' }, { pointer: '/c~0d', detail: 'two' }]));
    expect(form.get(['a/b'])!.errors).toEqual({ server: 'one' });
    expect(form.get(['c~d'])!.errors).toEqual({ server: 'two' });
  });
});

describe('fieldMessage', () => {
  it('words the built-in validators plainly and prefers a validator’s own message', () => {
    expect(fieldMessage({ required: true })).toBe('Required.');
    expect(fieldMessage({ min: { min: 0, actual: -1 } })).toBe('At least 0.');
    expect(fieldMessage({ minlength: { requiredLength: 10, actualLength: 3 } })).toBe('At least 10 characters.');
    expect(fieldMessage({ custom: { message: 'Needs a conjugate.' } })).toBe('Needs a conjugate.');
    expect(fieldMessage(null)).toBe('');
  });
});
