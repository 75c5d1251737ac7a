/*
 * The demo models: the loops of Quillfield Conveyor Works (demo/scenario.json, an invented company),
 * each with a first revision, and a second revision on two of them, as an engineer would have saved them.
 */
import { designGains, locus, type GainRange, type Plant } from '@polewright/locus-core';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { REPO_ROOT } from '../config.js';
import type { AppContext } from '../context.js';
import { etagOf, type ModelInput } from './model.js';
import { readModelInput } from './model-input.js';
import { listModels } from './models.repository.js';
import { createModel, updateModel } from './models.service.js';

interface ScenarioLoop {
  key: string;
  name: string;
  description: string;
  tags: string[];
  plant: Plant;
}

/** The demo scenario's loops. */
export function scenarioLoops(path = resolve(REPO_ROOT, 'demo', 'scenario.json')): ScenarioLoop[] {
  return (JSON.parse(readFileSync(path, 'utf8')) as { loops: ScenarioLoop[] }).loops;
}

/** A gain inside a range: the middle of [0, to], the geometric middle of [from, to] when from > 0 (3 significant figures). */
export function middleGain(range: GainRange): number {
  const to = range.to ?? Math.max(1, range.from) * 10;
  const middle = range.from > 0 ? Math.sqrt(range.from * to) : to / 2;
  return Number(middle.toPrecision(3));
}

/** Second revisions: what changed, and why. */
const RETUNES: Record<string, (loop: ScenarioLoop, first: ModelInput) => ModelInput | null> = {
  // commissioning found the header pressure too oscillatory at half the stability limit
  'compressor-header-pressure': (loop, first) => {
    const targets = { minDampingRatio: 0.4 };
    const range = designGains({ plant: loop.plant, targets }).gainRanges[0];
    if (!range) return null;
    const gain = middleGain(range);
    return { ...first, design: { gain, targets }, comment: `Retuned for damping ratio ≥ 0.4 after the ring oscillated on start-up: gain lowered from ${first.design.gain} to ${gain} (design range 0–${range.to?.toPrecision(3)}).` };
  },
  // the dryer overshot after pallet changes at the first gain
  'dryer-supply-air': (loop, first) => {
    const targets = { minDampingRatio: 0.4 };
    const range = designGains({ plant: loop.plant, targets }).gainRanges[0];
    if (!range) return null;
    const gain = middleGain(range);
    return { ...first, tags: [...first.tags, 'retuned'], design: { gain, targets }, comment: `Gain reduced from ${first.design.gain} to ${gain} for damping ratio ≥ 0.4: the supply air overshot by about 3 K after a pallet change.` };
  },
};

/**
 * Seeds the demo models into a database without models, authored by `authorId`. Revision 1 of each loop
 * carries the gain in the middle of its exact stable range (the core's `locus`); two loops get a second,
 * retuned revision whose gain meets a damping target (the core's `designGains`).
 */
export async function seedDemoModels(context: AppContext, authorId: string): Promise<void> {
  const existing = await listModels(context.dataSource, { sort: 'name', order: 'asc', page: 1, pageSize: 1, includeDeleted: true });
  if (existing.total > 0) return;
  for (const loop of scenarioLoops()) {
    const stable = locus({ plant: loop.plant }).stableGainRanges[0];
    const gain = stable ? middleGain(stable) : null;
    const first = readModelInput({
      name: loop.name,
      description: loop.description,
      tags: loop.tags,
      plant: loop.plant,
      compensator: null,
      design: { gain, targets: null },
      comment: gain === null ? 'First model from the commissioning notes.' : `First model from the commissioning notes; gain ${gain} sits in the middle of the stable range.`,
    });
    const created = await createModel(context, first, authorId);
    const retune = RETUNES[loop.key]?.(loop, first);
    if (retune) await updateModel(context, created.id, etagOf(created.id, created.revision), readModelInput(retune), authorId);
  }
}
