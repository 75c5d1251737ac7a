import { closedLoop, locus, type Complex } from '@polewright/locus-core';
import { DEMO_PLANTS } from '../../testing/demo-loops';
import { pointAtGain } from './branch';
import { gainMarkers, groupCoincident, poleMarkPath } from './markers';

describe('markers', () => {
  it('puts one marker on every branch, at the closed-loop poles of the core', () => {
    const result = locus({ plant: DEMO_PLANTS.hoistPosition });
    const gain = 100;
    const markers = gainMarkers(result, gain);
    expect(markers.map((m) => m.branch)).toEqual([0, 1, 2, 3, 4]);
    const expected = closedLoop({ plant: DEMO_PLANTS.hoistPosition, gain }).poles;
    for (const m of markers) {
      expect(Math.min(...expected.map((p) => Math.hypot(p.re - m.pole.re, p.im - m.pole.im)))).toBeLessThan(1e-7);
      // each marker lies on its own branch (the chord between traced points, within tracking tolerance)
      const onBranch = pointAtGain(result.branches[m.branch].points, gain) as Complex;
      expect(Math.hypot(onBranch.re - m.pole.re, onBranch.im - m.pole.im)).toBeLessThan(0.05);
    }
  });

  it('has no markers for a gain that is not a number', () => {
    expect(gainMarkers(locus({ plant: DEMO_PLANTS.beltSpeed }), Number.NaN)).toEqual([]);
  });

  it('merges coincident open-loop poles into one mark with a count', () => {
    const groups = groupCoincident(locus({ plant: DEMO_PLANTS.hoistPosition }).openLoop.poles);
    expect(groups.map((g) => g.count).sort()).toEqual([1, 1, 3]);
    const origin = groups.find((g) => g.count === 3);
    expect(Math.hypot(origin?.point.re ?? 1, origin?.point.im ?? 1)).toBeLessThan(1e-9);
  });

  it('draws the pole mark as four strokes that leave the centre open', () => {
    const d = poleMarkPath(6);
    expect(d.match(/M/g)?.length).toBe(4);
    expect(d).not.toContain('M0,0');
  });
});
