import { editorForm, fillPlant } from './editor-form';
import { clearEngineErrors, editorLocator, engineVerdict, hasOwnErrors, placeEngineIssues } from './engine-check';
import { emptyPlantFields } from './plant-body';

describe('engineVerdict (the engine’s own check, as the API runs it)', () => {
  it('accepts a proper plant and passes on the engine’s notes', () => {
    const verdict = engineVerdict({ expression: '0.62/((5.8*s+1)*(1.4*s+1))', deadTime: 0.8, padeOrder: 3 }, null);
    expect(verdict.issues).toEqual([]);
    expect(verdict.warnings.map((w) => w.code)).toContain('dead-time-approximated');
  });

  it('names the field at fault with a pointer into the save body', () => {
    expect(engineVerdict({ expression: '(s+1)^2/(s+3)' }, null).issues).toEqual([{ pointer: '/plant/expression', detail: expect.stringContaining('the plant must be proper') }]);
    expect(engineVerdict({ expression: '1/(z-0.5)', domain: 'z' }, null).issues).toEqual([{ pointer: '/plant/sampleTime', detail: expect.stringContaining('is required for a z-domain plant') }]);
  });

  it('refuses a loop the kept compensator makes improper, at /compensator as the API does', () => {
    const verdict = engineVerdict({ expression: '1/(s+1)' }, { zeros: [{ re: -2, im: 0 }, { re: -3, im: 0 }], poles: [], gain: 1 });
    expect(verdict.issues).toEqual([{ pointer: '/compensator', detail: expect.stringMatching(/^makes the loop \(compensator × plant\) unusable: makes the loop improper/) }]);
  });
});

describe('editorLocator', () => {
  const form = editorForm();
  const locate = editorLocator(form);

  it('finds the deepest control on a pointer’s path', () => {
    expect(locate('/plant/expression')).toBe(form.controls.plant.controls.expression);
    expect(locate('/plant/numerator/3')).toBe(form.controls.plant.controls.numerator);
    expect(locate('/tags/2')).toBe(form.controls.tags);
    expect(locate('/name')).toBe(form.controls.name);
    expect(locate('/plant/discretize')).toBe(form.controls.plant.controls.discretize.controls.sampleTime);
  });

  it('leaves the whole plant, the compensator and the design to the summary', () => {
    expect(locate('/plant')).toBeNull();
    expect(locate('/compensator/zeros/0')).toBeNull();
    expect(locate('/design/targets/minDampingRatio')).toBeNull();
    expect(locate('')).toBeNull();
  });

  it('finds a row of poles', () => {
    fillPlant(form.controls.plant, { ...emptyPlantFields(), form: 'factored', poles: [{ re: -1, im: 0 }, { re: -2, im: 0 }] });
    expect(locate('/plant/poles/1')).toBe(form.controls.plant.controls.poles.at(1));
  });
});

describe('engine messages on the form', () => {
  it('puts them on their controls, keeps them apart from the form’s own errors, and clears them', () => {
    const form = editorForm();
    const plant = form.controls.plant;
    plant.controls.expression.setValue('(s+1)^2/(s+3)');
    const unplaced = placeEngineIssues([{ pointer: '/plant/expression', detail: 'has degree 2' }, { pointer: '/compensator', detail: 'x' }], editorLocator(form));
    expect(unplaced.map((u) => u.pointer)).toEqual(['/compensator']);
    expect(plant.controls.expression.errors).toEqual({ engine: { message: 'has degree 2' } });
    expect(plant.invalid).toBe(true);
    expect(hasOwnErrors(plant)).toBe(false);
    clearEngineErrors(plant);
    expect(plant.controls.expression.errors).toBeNull();
    expect(plant.valid).toBe(true);
  });
});
