import fc from 'fast-check';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { MAX_DEGREE, ValidationError, closedLoop, designGains, locus } from '../../projects/locus-core/src/public-api';
import { BoundedCore, describeOutcome, type Outcome } from '../support/bounded-core';

/*
 * Every malformed request must be refused with a ValidationError whose first issue points (RFC 6901
 * JSON Pointer) at the field at fault; no request, however odd, may end in any other kind of error.
 */

/** The pointer of the first issue of the ValidationError thrown by `run`; fails if it throws anything else or nothing. */
function pointerOf(run: () => unknown): string {
  let thrown: unknown = undefined;
  try {
    run();
  } catch (error) {
    thrown = error;
  }
  expect(thrown, 'expected the request to be refused').toBeInstanceOf(ValidationError);
  const issues = (thrown as ValidationError).issues;
  expect(issues.length).toBeGreaterThan(0);
  return issues[0].pointer;
}

const PLANT = { expression: '1/(s*(s+2))' };
const poles = (count: number) => Array.from({ length: count }, (_, k) => ({ re: -1 - k / count, im: 0 }));

describe('locus refuses malformed plants, naming the field', () => {
  it.each<[string, unknown, string]>([
    ['a NaN coefficient', { numerator: [1], denominator: [1, 2, NaN] }, '/plant/denominator/2'],
    ['an infinite coefficient', { numerator: [Infinity], denominator: [1, 2] }, '/plant/numerator/0'],
    ['a string where a coefficient belongs', { numerator: ['1'], denominator: [1, 2] }, '/plant/numerator/0'],
    ['null where a coefficient belongs', { numerator: [1], denominator: [1, null] }, '/plant/denominator/1'],
    ['an object instead of a coefficient list', { numerator: { 0: 1 }, denominator: [1, 2] }, '/plant/numerator'],
    ['an empty coefficient list', { numerator: [], denominator: [1, 2] }, '/plant/numerator'],
    ['an improper plant (more zeros than poles)', { numerator: [1, 2, 3], denominator: [1, 2] }, '/plant/numerator'],
    ['an improper expression', { expression: '(s+1)^2/(s+3)' }, '/plant/expression'],
    ['a zero numerator', { numerator: [0, 0], denominator: [1, 2] }, '/plant/numerator'],
    ['a zero denominator', { numerator: [1], denominator: [0] }, '/plant/denominator'],
    ['a z-plant without a sample time', { numerator: [1], denominator: [1, -0.5], domain: 'z' }, '/plant/sampleTime'],
    ['a zero sample time', { numerator: [1], denominator: [1, -0.5], domain: 'z', sampleTime: 0 }, '/plant/sampleTime'],
    ['a string sample time', { numerator: [1], denominator: [1, -0.5], domain: 'z', sampleTime: '0.1' }, '/plant/sampleTime'],
    ['an infinite sample time', { numerator: [1], denominator: [1, -0.5], domain: 'z', sampleTime: Infinity }, '/plant/sampleTime'],
    ['an unknown domain', { numerator: [1], denominator: [1, 2], domain: 'w' }, '/plant/domain'],
    ['a complex pole without its conjugate', { poles: [{ re: -1, im: 2 }, { re: -3, im: 0 }], zeros: [], gain: 1 }, '/plant/poles'],
    ['a complex zero without its conjugate', { poles: [{ re: -1, im: 0 }, { re: -3, im: 0 }], zeros: [{ re: -2, im: 1 }], gain: 1 }, '/plant/zeros'],
    ['a number where a complex pole belongs', { poles: [1], zeros: [], gain: 1 }, '/plant/poles/0'],
    ['a string imaginary part', { poles: [{ re: -1, im: '2' }], zeros: [], gain: 1 }, '/plant/poles/0'],
    ['an object instead of the pole list', { poles: { re: -1, im: 0 }, gain: 1 }, '/plant/poles'],
    ['a zero gain constant', { poles: [{ re: -1, im: 0 }], zeros: [], gain: 0 }, '/plant/gain'],
    ['an infinite gain constant', { poles: [{ re: -1, im: 0 }], zeros: [], gain: -Infinity }, '/plant/gain'],
    ['an expression that does not parse', { expression: '(s+1' }, '/plant/expression'],
    ['an expression with an unknown symbol', { expression: 'k/(s+1)' }, '/plant/expression'],
    ['an expression that is not a string', { expression: 42 }, '/plant/expression'],
    ['an empty expression', { expression: '' }, '/plant/expression'],
    ['a huge exponent', { expression: '1/(s+1)^1000000000' }, '/plant/expression'],
    ['a number too large for double precision', { expression: '1e999/(s+1)' }, '/plant/expression'],
    ['a Padé order of 0', { ...PLANT, deadTime: 0.1, padeOrder: 0 }, '/plant/padeOrder'],
    ['a Padé order of 11', { ...PLANT, deadTime: 0.1, padeOrder: 11 }, '/plant/padeOrder'],
    ['a fractional Padé order', { ...PLANT, deadTime: 0.1, padeOrder: 2.5 }, '/plant/padeOrder'],
    ['a string Padé order', { ...PLANT, deadTime: 0.1, padeOrder: '3' }, '/plant/padeOrder'],
    ['a negative dead time', { ...PLANT, deadTime: -1 }, '/plant/deadTime'],
    ['a NaN dead time', { ...PLANT, deadTime: NaN }, '/plant/deadTime'],
    ['dead time that is not a whole number of samples (z)', { numerator: [1], denominator: [1, -0.5], domain: 'z', sampleTime: 0.1, deadTime: 0.15 }, '/plant/deadTime'],
    ['dead time of more samples than the degree limit allows (z)', { numerator: [1], denominator: [1, -0.5], domain: 'z', sampleTime: 1, deadTime: 100 }, '/plant/deadTime'],
    ['discretising a plant that is already sampled', { numerator: [1], denominator: [1, -0.5], domain: 'z', sampleTime: 0.1, discretize: { sampleTime: 0.1 } }, '/plant/discretize'],
    ['a zero discretisation period', { ...PLANT, discretize: { sampleTime: 0 } }, '/plant/discretize/sampleTime'],
    ['a number instead of the discretize object', { ...PLANT, discretize: 0.1 }, '/plant/discretize/sampleTime'],
    [`a denominator of degree ${MAX_DEGREE + 1}`, { numerator: [1], denominator: [1, ...new Array<number>(MAX_DEGREE + 1).fill(1)] }, '/plant/denominator'],
    [`${MAX_DEGREE + 1} factored poles`, { poles: poles(MAX_DEGREE + 1), zeros: [], gain: 1 }, '/plant/poles'],
    [`an expression of degree ${MAX_DEGREE + 1}`, { expression: '1/((s+1)^31*(s+2)^30)' }, '/plant/expression'],
    [`a Padé approximant that lifts the degree past ${MAX_DEGREE}`, { numerator: [1], denominator: [1, ...new Array<number>(55).fill(1)], deadTime: 1, padeOrder: 10 }, '/plant/padeOrder'],
    ['two plant forms at once', { numerator: [1], denominator: [1, 2], expression: '1/(s+2)' }, '/plant'],
    ['no plant form at all', { domain: 's' }, '/plant'],
  ])('refuses %s', (_, plant, pointer) => {
    expect(pointerOf(() => locus({ plant } as never))).toBe(pointer);
  });

  it.each<[string, unknown, string]>([
    ['a null request', null, ''],
    ['a string request', 'plant', ''],
    ['a request without a plant', {}, '/plant'],
    ['a null plant', { plant: null }, '/plant'],
    ['an array instead of the plant object', { plant: [1, 2] }, '/plant'],
    ['a string instead of the plant object', { plant: '1/(s+1)' }, '/plant'],
    ['an array instead of the gainRange object', { plant: PLANT, gainRange: [0, 10] }, '/gainRange'],
    ['a string gainRange.max', { plant: PLANT, gainRange: { max: '10' } }, '/gainRange/max'],
    ['a negative gainRange.max', { plant: PLANT, gainRange: { max: -1 } }, '/gainRange/max'],
    ['an infinite gainRange.max', { plant: PLANT, gainRange: { max: Infinity } }, '/gainRange/max'],
    ['a NaN gainRange.min', { plant: PLANT, gainRange: { min: NaN } }, '/gainRange/min'],
    ['gainRange.min above gainRange.max', { plant: PLANT, gainRange: { min: 5, max: 2 } }, '/gainRange/min'],
    ['a string includeNegativeGains', { plant: PLANT, includeNegativeGains: 'yes' }, '/includeNegativeGains'],
  ])('refuses %s', (_, request, pointer) => {
    expect(pointerOf(() => locus(request as never))).toBe(pointer);
  });
});

describe('locus refuses plants whose numbers cannot be represented once normalised', () => {
  it('refuses coefficients whose ratio overflows double precision (1e300 over 1e-300·s + 1)', () => {
    // making the denominator monic divides by 1e-300 and turns 1e300 into Infinity
    expect(pointerOf(() => locus({ plant: { numerator: [1e300], denominator: [1e-300, 1] } }))).toMatch(/^\/plant/);
  });

  it('refuses a dead time so long that its Padé coefficients overflow', () => {
    expect(pointerOf(() => locus({ plant: { ...PLANT, deadTime: 1e308 } }))).toMatch(/^\/plant/);
  });

  it('refuses dead time of an astronomical number of samples on a z-plant without trying to build it', () => {
    expect(pointerOf(() => locus({ plant: { numerator: [1], denominator: [1, -0.5], domain: 'z', sampleTime: 1e-300, deadTime: 1 } }))).toBe('/plant/deadTime');
  });

  it('refuses dead time of an astronomical number of samples on a discretised plant without trying to build it', () => {
    expect(pointerOf(() => locus({ plant: { numerator: [1], denominator: [1, 1], discretize: { sampleTime: 1e-300 }, deadTime: 1 } }))).toBe('/plant/deadTime');
  });
});

describe('closedLoop refuses malformed requests, naming the field', () => {
  it.each<[string, unknown, string]>([
    ['a missing gain', { plant: PLANT }, '/gain'],
    ['a NaN gain', { plant: PLANT, gain: NaN }, '/gain'],
    ['an infinite gain', { plant: PLANT, gain: Infinity }, '/gain'],
    ['a string gain', { plant: PLANT, gain: '2' }, '/gain'],
    ['a null gain', { plant: PLANT, gain: null }, '/gain'],
    ['the ill-posed gain of a biproper plant', { plant: { expression: '(1-s)/(s+1)' }, gain: 1 }, '/gain'],
    ['an array instead of the step object', { plant: PLANT, gain: 1, step: [10, 100] }, '/step'],
    ['a null step', { plant: PLANT, gain: 1, step: null }, '/step'],
    ['a single step sample', { plant: PLANT, gain: 1, step: { points: 1 } }, '/step/points'],
    ['a fractional sample count', { plant: PLANT, gain: 1, step: { points: 100.5 } }, '/step/points'],
    ['a zero duration', { plant: PLANT, gain: 1, step: { duration: 0 } }, '/step/duration'],
    ['a NaN coefficient', { plant: { numerator: [1], denominator: [1, 2, NaN] }, gain: 1 }, '/plant/denominator/2'],
  ])('refuses %s', (_, request, pointer) => {
    expect(pointerOf(() => closedLoop(request as never))).toBe(pointer);
  });

  it('refuses, rather than fails on, coefficients whose ratio overflows double precision', () => {
    expect(pointerOf(() => closedLoop({ plant: { numerator: [1e300], denominator: [1e-300, 1] }, gain: 1 }))).toMatch(/^\/plant/);
  });
});

describe('designGains refuses malformed requests, naming the field', () => {
  it.each<[string, unknown, string]>([
    ['a damping ratio of 1.5', { targets: { minDampingRatio: 1.5 } }, '/targets/minDampingRatio'],
    ['a damping ratio of 0', { targets: { minDampingRatio: 0 } }, '/targets/minDampingRatio'],
    ['a string damping ratio', { targets: { minDampingRatio: '0.5' } }, '/targets/minDampingRatio'],
    ['0 % overshoot', { targets: { maxOvershootPct: 0 } }, '/targets/maxOvershootPct'],
    ['100 % overshoot', { targets: { maxOvershootPct: 100 } }, '/targets/maxOvershootPct'],
    ['a negative settling time', { targets: { maxSettlingTime: -1 } }, '/targets/maxSettlingTime'],
    ['an infinite settling time', { targets: { maxSettlingTime: Infinity } }, '/targets/maxSettlingTime'],
    ['a frequency band with min above max', { targets: { naturalFrequency: { min: 5, max: 2 } } }, '/targets/naturalFrequency/min'],
    ['a zero frequency maximum', { targets: { naturalFrequency: { max: 0 } } }, '/targets/naturalFrequency/max'],
    ['a negative frequency minimum', { targets: { naturalFrequency: { min: -1 } } }, '/targets/naturalFrequency/min'],
    ['an array instead of the frequency band', { targets: { naturalFrequency: [1, 5] } }, '/targets/naturalFrequency'],
    ['an array instead of the targets object', { targets: [0.5] }, '/targets'],
    ['a null targets object', { targets: null }, '/targets'],
    ['a string instead of the targets object', { targets: 'fast' }, '/targets'],
    ['a damping line of 1.2', { dampingLines: [1.2] }, '/dampingLines/0'],
    ['a damping line of 0 after a valid one', { dampingLines: [0.5, 0] }, '/dampingLines/1'],
    ['a string damping line', { dampingLines: ['0.5'] }, '/dampingLines/0'],
    ['a number instead of the damping-line list', { dampingLines: 0.5 }, '/dampingLines'],
    ['25 damping lines', { dampingLines: new Array<number>(25).fill(0.5) }, '/dampingLines'],
    ['a string dominantOnly', { dominantOnly: 'yes' }, '/dominantOnly'],
  ])('refuses %s', (_, fields, pointer) => {
    expect(pointerOf(() => designGains({ plant: PLANT, ...(fields as object) } as never))).toBe(pointer);
  });

  it('refuses a malformed plant with the same pointer as locus does', () => {
    expect(pointerOf(() => designGains({ plant: { numerator: [1], denominator: [1, 2], domain: 'z' } } as never))).toBe('/plant/sampleTime');
  });
});

/* ---------------------------------------------------------------------------------------------- */
/* Arbitrary input: each call either returns a result or refuses with a ValidationError.         */
/* The calls run in a bounded worker so that a request that makes the engine run away ends as a  */
/* failed run instead of stopping the test process.                                               */
/* ---------------------------------------------------------------------------------------------- */

const core = new BoundedCore({ expressions: true, heapMb: 128 });
afterAll(() => core.close());
// a call still running when a test ends (it timed out) must not hold up the next test
afterEach(async () => {
  if (core.busy) await core.close();
});

const ENTRY_POINTS = ['locus', 'closedLoop', 'designGains'] as const;

/** Resolves an RFC 6901 pointer in a value; `undefined` when a token is missing. */
function resolve(value: unknown, pointer: string): { found: boolean; value: unknown } {
  if (pointer === '') return { found: true, value };
  if (!pointer.startsWith('/')) return { found: false, value: undefined };
  let current: unknown = value;
  for (const raw of pointer.slice(1).split('/')) {
    const token = raw.replace(/~1/g, '/').replace(/~0/g, '~');
    if (current === null || typeof current !== 'object' || !Object.prototype.hasOwnProperty.call(current, token)) return { found: false, value: undefined };
    current = (current as Record<string, unknown>)[token];
  }
  return { found: true, value: current };
}

/** Accepts a result or a ValidationError whose pointers are JSON pointers whose parent exists in the request. */
function expectResultOrValidation(fn: string, request: unknown, outcome: Outcome): void {
  if (outcome.kind === 'result') return;
  if (outcome.kind !== 'validation') throw new Error(`${fn}(${safeJson(request)}) ${describeOutcome(outcome)}`);
  expect(outcome.issues.length).toBeGreaterThan(0);
  for (const { pointer, detail } of outcome.issues) {
    expect(typeof detail === 'string' && detail.length > 0).toBe(true);
    expect(pointer === '' || pointer.startsWith('/'), `pointer "${pointer}"`).toBe(true);
    const parent = pointer.slice(0, Math.max(0, pointer.lastIndexOf('/')));
    expect(resolve(request, parent).found, `${fn}: the parent of "${pointer}" is not in ${safeJson(request)}`).toBe(true);
  }
}

function safeJson(value: unknown): string {
  try {
    return JSON.stringify(value, (_, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v === undefined ? '<undefined>' : v))?.slice(0, 600) ?? String(value);
  } catch {
    return String(value);
  }
}

const VALID: Record<(typeof ENTRY_POINTS)[number], unknown[]> = {
  locus: [
    { plant: { expression: '2*(s+1)/(s*(s+3)*(s^2+2*s+5))' }, gainRange: { max: 50 } },
    { plant: { poles: [{ re: -1, im: 2 }, { re: -1, im: -2 }, { re: -4, im: 0 }], zeros: [{ re: -2, im: 0 }], gain: 2 }, includeNegativeGains: true },
    { plant: { numerator: [1, 0.5], denominator: [1, -1.2, 0.35], domain: 'z', sampleTime: 0.1 } },
    { plant: { numerator: [1], denominator: [1, 1], deadTime: 0.5, padeOrder: 2 } },
  ],
  closedLoop: [
    { plant: { expression: '1/(s*(s+2))' }, gain: 3, step: { duration: 8, points: 200 } },
    { plant: { numerator: [0.1], denominator: [1, -1.5, 0.5], domain: 'z', sampleTime: 0.1 }, gain: 0.5 },
  ],
  designGains: [
    { plant: { expression: '1/(s*(s+1)*(s+5))' }, targets: { minDampingRatio: 0.4, maxSettlingTime: 12, maxOvershootPct: 30, naturalFrequency: { min: 0.1, max: 10 } }, dampingLines: [0.5, 0.7], dominantOnly: false },
    { plant: { numerator: [0.1], denominator: [1, -1.5, 0.5], domain: 'z', sampleTime: 0.1 }, targets: { minDampingRatio: 0.5 }, dampingLines: [0.5] },
  ],
};

/** Every path (as a list of keys) inside a JSON-like value, the root included. */
function pathsOf(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out = [prefix];
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...pathsOf(v, [...prefix, i])));
  else if (value !== null && typeof value === 'object') for (const [k, v] of Object.entries(value)) out.push(...pathsOf(v, [...prefix, k]));
  return out;
}

type Mutation = { kind: 'replace'; path: (string | number)[]; value: unknown } | { kind: 'delete'; path: (string | number)[] } | { kind: 'add'; path: (string | number)[]; key: string; value: unknown };

function applyMutation(base: unknown, mutation: Mutation): unknown {
  const copy = structuredClone(base);
  if (mutation.path.length === 0) return mutation.kind === 'replace' ? mutation.value : mutation.kind === 'add' ? { ...(copy as object), [mutation.key]: mutation.value } : undefined;
  let parent = copy as Record<string | number, unknown>;
  for (const key of mutation.path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
  const last = mutation.path[mutation.path.length - 1];
  if (mutation.kind === 'replace') parent[last] = mutation.value;
  else if (mutation.kind === 'delete') {
    if (Array.isArray(parent)) parent.splice(last as number, 1);
    else delete parent[last];
  } else {
    const target = parent[last];
    if (target !== null && typeof target === 'object' && !Array.isArray(target)) (target as Record<string, unknown>)[mutation.key] = mutation.value;
    else parent[last] = { [mutation.key]: mutation.value };
  }
  return copy;
}

/** Values worth trying in any slot: odd numbers, wrong types, and arbitrary JSON. */
const ODD_VALUE = fc.oneof(
  fc.constantFrom<unknown>(NaN, Infinity, -Infinity, -0, 0, -1, 1e-300, 1e300, Number.MAX_VALUE, Number.MIN_VALUE, 2 ** 53, '', '1', 's', 'z', null, true, [], {}, [[]], { re: 1 }),
  fc.jsonValue({ maxDepth: 2 }),
  fc.double(),
  fc.integer({ min: -100, max: 100 }),
);

function mutationOf(base: unknown): fc.Arbitrary<Mutation> {
  const paths = pathsOf(base);
  const path = fc.constantFrom(...paths);
  return fc.oneof(
    fc.record({ kind: fc.constant('replace' as const), path, value: ODD_VALUE }),
    fc.record({ kind: fc.constant('delete' as const), path }),
    fc.record({ kind: fc.constant('add' as const), path, key: fc.constantFrom('re', 'im', 'gain', 'poles', 'numerator', 'expression', 'domain', 'sampleTime', 'min', 'max', 'extra'), value: ODD_VALUE }),
  );
}

const FUZZ_RUNS = 120;

describe.each(ENTRY_POINTS)('%s on arbitrary input', (fn) => {
  it('returns a result or throws a ValidationError for any value at all (fc.anything)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.anything({ maxDepth: 3 }), async (request) => {
        expectResultOrValidation(fn, request, await core.call(fn, [request], false));
      }),
      { seed: 8101, numRuns: FUZZ_RUNS, endOnFailure: true },
    );
  });

  it('returns a result or throws a ValidationError for any JSON request with a plant-like shape', async () => {
    const plantish = fc.record(
      {
        plant: fc.oneof(
          fc.jsonValue({ maxDepth: 2 }),
          fc.record({ numerator: fc.array(fc.jsonValue({ maxDepth: 0 }), { maxLength: 4 }), denominator: fc.array(fc.jsonValue({ maxDepth: 0 }), { maxLength: 5 }) }, { requiredKeys: [] }),
          fc.record({ expression: fc.oneof(fc.string({ maxLength: 20 }), fc.constantFrom('1/(s+1)', '(s+2)/(s^2+s+1)', '1/(s', 's^s', 'z/(z-1)')), domain: fc.constantFrom('s', 'z', 'q') }, { requiredKeys: ['expression'] }),
        ),
        gain: fc.jsonValue({ maxDepth: 1 }),
        gainRange: fc.jsonValue({ maxDepth: 1 }),
        targets: fc.jsonValue({ maxDepth: 2 }),
        dampingLines: fc.jsonValue({ maxDepth: 1 }),
        step: fc.jsonValue({ maxDepth: 1 }),
      },
      { requiredKeys: ['plant'] },
    );
    await fc.assert(
      fc.asyncProperty(plantish, async (request) => {
        expectResultOrValidation(fn, request, await core.call(fn, [request], false));
      }),
      { seed: 8102, numRuns: FUZZ_RUNS, endOnFailure: true },
    );
  });

  it('returns a result or throws a ValidationError for any single mutation of a valid request', async () => {
    const mutated = fc.constantFrom(...VALID[fn]).chain((base) => mutationOf(base).map((m) => ({ base, mutation: m })));
    await fc.assert(
      fc.asyncProperty(mutated, async ({ base, mutation }) => {
        const request = applyMutation(base, mutation);
        expectResultOrValidation(fn, request, await core.call(fn, [request], false));
      }),
      { seed: 8103, numRuns: FUZZ_RUNS, endOnFailure: true },
    );
  });
});

describe('requests at the edge of double precision end in a result or a field error', () => {
  it('discretises 1/(s + 1) at an astronomically long sampling period to the settled plant 1/z', () => {
    // the held step settles completely within one period: G(z) = (1 − e^(−T))/(z − e^(−T)) → 1/z
    const result = locus({ plant: { numerator: [1], denominator: [1, 1], discretize: { sampleTime: 1e308 } } });
    expect(result.normalizedPlant.denominator).toEqual([1, 0]);
    expect(result.normalizedPlant.numerator[0]).toBeCloseTo(1, 12);
  });

  it('refuses to discretise an unstable plant where e^(pole·T) overflows, naming the sampling period', () => {
    expect(() => locus({ plant: { numerator: [1], denominator: [1, -1], discretize: { sampleTime: 1e308 } } })).toThrow(ValidationError);
    try {
      locus({ plant: { numerator: [1], denominator: [1, -1], discretize: { sampleTime: 1e308 } } });
    } catch (error) {
      expect((error as ValidationError).issues[0].pointer).toBe('/plant/discretize/sampleTime');
    }
  });

  it('refuses a gain range beyond any physical meaning instead of tracing it', () => {
    for (const [range, pointer] of [[{ max: 1e308 }, '/gainRange/max'], [{ min: -1e308 }, '/gainRange/min']] as const) {
      try {
        locus({ plant: { numerator: [1], denominator: [1, 2, 0] }, gainRange: range });
        expect.unreachable('the request should have been refused');
      } catch (error) {
        expect(error).toBeInstanceOf(ValidationError);
        expect((error as ValidationError).issues[0].pointer).toBe(pointer);
      }
    }
  });
});
