import { placeLabels, visibleFixedLabels } from './labels';

const bounds = { x0: 0, y0: 0, x1: 400, y1: 300 };

describe('label placement', () => {
  it('puts a lone label right of and above its mark', () => {
    expect(placeLabels([{ x: 100, y: 100, text: 'K 2' }], bounds)).toEqual([{ x: 107, y: 93, anchor: 'start', visible: true }]);
  });

  it('moves a second label at the same mark to another side instead of overlapping', () => {
    const [a, b] = placeLabels(
      [
        { x: 100, y: 100, text: 'K 1.078' },
        { x: 102, y: 100, text: 'K 21.09' },
      ],
      bounds,
    );
    expect(a.visible && b.visible).toBe(true);
    expect([a.x, a.y]).not.toEqual([b.x, b.y]);
    expect(Math.abs(a.y - b.y) >= 12 || a.anchor !== b.anchor).toBe(true);
  });

  it('keeps labels inside the plotting area and hides one with no room left', () => {
    const [edge] = placeLabels([{ x: 395, y: 100, text: 'K 481.2' }], bounds);
    expect(edge.anchor).toBe('end');
    const crowd = placeLabels(Array.from({ length: 8 }, () => ({ x: 200, y: 150, text: 'K 12.34' })), bounds);
    expect(crowd.filter((l) => !l.visible).length).toBeGreaterThan(0);
  });

  it('thins out fixed labels that would overlap an earlier one', () => {
    const shown = visibleFixedLabels([
      { x: 100, y: 20, text: 'ζ 0.4', anchor: 'start' },
      { x: 110, y: 20, text: 'ζ 0.2', anchor: 'start' },
      { x: 200, y: 20, text: 'ζ 0.6', anchor: 'start' },
    ]);
    expect(shown).toEqual([true, false, true]);
  });
});
