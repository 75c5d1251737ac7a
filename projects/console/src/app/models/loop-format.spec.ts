import { formatComplex, formatNumber, formatRoots, formatSeconds, gainText, loopDomain, plantFormula, targetsText } from './loop-format';

describe('loop format', () => {
  it('writes numbers as stored, or to a number of significant figures', () => {
    expect(formatNumber(2.4617)).toBe('2.4617');
    expect(formatNumber(2.4617, 3)).toBe('2.46');
    expect(formatNumber(107)).toBe('107');
    expect(formatNumber(0)).toBe('0');
    expect(formatNumber(0.00005)).toBe('5e-5');
    expect(formatNumber(1234567, 4)).toBe('1.235e+6');
  });

  it('writes times with a unit that keeps the number readable', () => {
    expect(formatSeconds(0.00005)).toBe('50 µs');
    expect(formatSeconds(0.02)).toBe('20 ms');
    expect(formatSeconds(0.8)).toBe('0.8 s');
    expect(formatSeconds(2)).toBe('2 s');
  });

  it('writes conjugate pairs once with ± and keeps lone complex values as they are', () => {
    expect(formatRoots([{ re: -1, im: 0 }, { re: -0.5, im: 2 }, { re: -0.5, im: -2 }])).toBe('-1, -0.5 ± 2j');
    expect(formatRoots([{ re: -3 }])).toBe('-3');
    expect(formatRoots([])).toBe('none');
    expect(formatComplex({ re: 1, im: -2 })).toBe('1 − 2j');
  });

  it('names the plane and sampling of each plant form', () => {
    expect(loopDomain({ expression: '1/(s+1)' })).toEqual({ plane: 's', label: 's', note: '' });
    expect(loopDomain({ expression: '1/(s+1)', deadTime: 0.8 })).toEqual({ plane: 's', label: 's', note: 'dead time 0.8 s' });
    expect(loopDomain({ expression: '0.1/(z-0.9)', domain: 'z', sampleTime: 0.00005 })).toEqual({ plane: 'z', label: 'z · T = 50 µs', note: '' });
    expect(loopDomain({ expression: '1/(38*s+1)', deadTime: 3, discretize: { sampleTime: 2 } })).toEqual({ plane: 'z', label: 'z · T = 2 s', note: 'ZOH of an s-plant, dead time 3 s' });
  });

  it('writes the transfer function of each plant form on one line', () => {
    expect(plantFormula({ expression: '4/(s*(s+2))' })).toBe('4/(s*(s+2))');
    expect(plantFormula({ numerator: [4], denominator: [1, 2, 0] })).toBe('[4] / [1, 2, 0]');
    expect(plantFormula({ poles: [{ re: 0 }, { re: -2 }], gain: 4 })).toBe('gain 4, zeros none, poles 0, -2');
  });

  it('sums up design targets and the design gain', () => {
    expect(targetsText(null)).toBe('none');
    expect(targetsText({ minDampingRatio: 0.4, maxSettlingTime: 8 })).toBe('ζ ≥ 0.4, Ts ≤ 8 s');
    expect(targetsText({ naturalFrequency: { min: 1, max: 5 }, maxOvershootPct: 10 })).toBe('overshoot ≤ 10 %, 1 ≤ ωn ≤ 5 rad/s');
    expect(gainText(null)).toBe('not set');
    expect(gainText(8.3512, 4)).toBe('8.351');
  });
});
