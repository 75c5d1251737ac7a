/** A label to place beside a mark at (x, y) px. */
export interface LabelRequest {
  readonly x: number;
  readonly y: number;
  readonly text: string;
}

/** Where a label goes: its text anchor point and alignment, or hidden when there was no room. */
export interface PlacedLabel {
  readonly x: number;
  readonly y: number;
  readonly anchor: 'start' | 'end';
  readonly visible: boolean;
}

/** Approximate glyph box of the 10.5 px label font (no layout in this code path; close enough to avoid overlaps). */
const CHAR_WIDTH = 6;
const LINE_HEIGHT = 12;

// candidate spots around a mark, in order of preference: right-above, right-below, left-above, left-below
const SPOTS: readonly [number, number, 'start' | 'end'][] = [
  [7, -7, 'start'],
  [7, 14, 'start'],
  [-7, -7, 'end'],
  [-7, 14, 'end'],
  [7, 27, 'start'],
  [-7, -20, 'end'],
];

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/**
 * Greedy placement of mark labels so that none overlaps another or a mark: each label takes the first of
 * a few spots around its mark that is free and inside `bounds`; a label with no free spot is hidden (the
 * data table still lists it). `obstacles` are other marks (px) the labels keep clear of.
 */
export function placeLabels(requests: readonly LabelRequest[], bounds: Box, obstacles: readonly (readonly [number, number])[] = []): PlacedLabel[] {
  const taken: Box[] = obstacles.map(([x, y]) => ({ x0: x - 5, y0: y - 5, x1: x + 5, y1: y + 5 }));
  return requests.map((r) => {
    const width = r.text.length * CHAR_WIDTH;
    for (const [dx, dy, anchor] of SPOTS) {
      const x = r.x + dx;
      const y = r.y + dy;
      const box = anchor === 'start' ? { x0: x, y0: y - LINE_HEIGHT + 2, x1: x + width, y1: y + 2 } : { x0: x - width, y0: y - LINE_HEIGHT + 2, x1: x, y1: y + 2 };
      if (box.x0 < bounds.x0 || box.x1 > bounds.x1 || box.y0 < bounds.y0 || box.y1 > bounds.y1) continue;
      if (taken.some((t) => overlaps(t, box))) continue;
      taken.push(box);
      return { x, y, anchor, visible: true };
    }
    return { x: r.x, y: r.y, anchor: 'start', visible: false };
  });
}

function overlaps(a: Box, b: Box): boolean {
  return a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;
}

/**
 * Which of a row of fixed labels (guide labels: their place is given by the curve) can be shown without
 * overlapping an earlier one; `anchor` as in SVG text-anchor.
 */
export function visibleFixedLabels(labels: readonly { x: number; y: number; text: string; anchor: 'start' | 'end' }[]): boolean[] {
  const taken: Box[] = [];
  return labels.map((l) => {
    const width = l.text.length * CHAR_WIDTH;
    const box = l.anchor === 'start' ? { x0: l.x, y0: l.y - LINE_HEIGHT, x1: l.x + width, y1: l.y } : { x0: l.x - width, y0: l.y - LINE_HEIGHT, x1: l.x, y1: l.y };
    if (taken.some((t) => overlaps(t, box))) return false;
    taken.push(box);
    return true;
  });
}
