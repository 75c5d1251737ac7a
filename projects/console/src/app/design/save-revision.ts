import type { Compensator, DesignTargets, Model, ModelInput } from '../api/api-types';
import { modelInputOf } from '../models/model-input';
import { formatFigure, rootText, rowsOf } from './compensator-rows';

/** What the workspace asks to save: its compensator, gain and targets on top of a loaded model. */
export interface DesignEdits {
  readonly compensator: Compensator | null;
  readonly gain: number;
  readonly targets: DesignTargets | null;
}

/**
 * The PUT body of a design revision: the model's other content unchanged (name, description, tags and
 * plant of `base`), the edited compensator, `design: { gain, targets }`, and the revision comment.
 */
export function revisionBody(base: Model, edits: DesignEdits, comment: string): ModelInput {
  return { ...modelInputOf(base, comment.trim()), compensator: edits.compensator, design: { gain: edits.gain, targets: edits.targets } };
}

/** Whether two revisions have the same plant (a saved design was made for one plant). */
export function samePlant(a: Model, b: Model): boolean {
  return JSON.stringify(a.plant) === JSON.stringify(b.plant);
}

/** What a later revision changed against the one the edits started from, in words (empty: nothing that matters here). */
export function revisionChanges(from: Model, to: Model): string[] {
  const out: string[] = [];
  if (!samePlant(from, to)) out.push('the plant');
  if (JSON.stringify(from.compensator) !== JSON.stringify(to.compensator)) out.push(`the compensator (now ${compensatorText(to.compensator)})`);
  if (from.design.gain !== to.design.gain) out.push(`the design gain (K = ${from.design.gain === null ? 'none' : formatFigure(from.design.gain, 6)} → ${to.design.gain === null ? 'none' : formatFigure(to.design.gain, 6)})`);
  if (JSON.stringify(from.design.targets) !== JSON.stringify(to.design.targets)) out.push(`the targets (now ${targetsText(to.design.targets)})`);
  if (from.name !== to.name || from.description !== to.description || JSON.stringify(from.tags) !== JSON.stringify(to.tags)) out.push('name, description or tags');
  return out;
}

/** The compensator in one line: `zeros −2, −1 ± 3j; poles −20; gain 1.5`, or "none". */
export function compensatorText(c: Compensator | null): string {
  if (!c) return 'none (the plant alone)';
  const list = (roots: Compensator['zeros']): string => {
    const rows = rowsOf(roots ?? []);
    return rows.length ? rows.map(rootText).join(', ') : 'none';
  };
  return `zeros ${list(c.zeros)}; poles ${list(c.poles)}; gain ${formatFigure(c.gain ?? 1, 6)}`;
}

/** The targets in one line, or "none". */
export function targetsText(t: DesignTargets | null): string {
  if (!t) return 'none';
  const parts: string[] = [];
  if (t.minDampingRatio !== undefined) parts.push(`ζ ≥ ${formatFigure(t.minDampingRatio)}`);
  if (t.maxSettlingTime !== undefined) parts.push(`settling ≤ ${formatFigure(t.maxSettlingTime)} s`);
  if (t.maxOvershootPct !== undefined) parts.push(`overshoot ≤ ${formatFigure(t.maxOvershootPct)} %`);
  if (t.naturalFrequency?.min !== undefined) parts.push(`ωn ≥ ${formatFigure(t.naturalFrequency.min)} rad/s`);
  if (t.naturalFrequency?.max !== undefined) parts.push(`ωn ≤ ${formatFigure(t.naturalFrequency.max)} rad/s`);
  return parts.join(', ') || 'none';
}
