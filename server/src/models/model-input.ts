import { designGains, loopPlant, normalizePlant, readCompensator, ValidationError, type Compensator, type DesignTargets, type Plant } from '@polewright/locus-core';
import { InputError, type InputIssue as Issue } from '../http/errors.js';
import type { ModelDesign, ModelInput } from './model.js';

/** Limits of the editable fields (see CONTRACTS.md). */
export const MODEL_LIMITS = { name: 120, description: 4000, tags: 20, tagLength: 40, comment: 500 } as const;

const TAG = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;
const PLANT_KEYS = ['expression', 'numerator', 'denominator', 'zeros', 'poles', 'gain', 'domain', 'sampleTime', 'deadTime', 'padeOrder', 'discretize'] as const;

/**
 * Checks a create/update body (or an imported row) and returns the model content it describes.
 * The plant goes through the core's `normalizePlant`, the whole loop (compensator × plant) too, and design
 * targets through `designGains`, so that what is stored is exactly what the engine accepts.
 * Throws `InputError` listing every field at fault as a JSON Pointer into `body`.
 */
export function readModelInput(body: unknown): ModelInput {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) throw new InputError([{ pointer: '', detail: 'must be an object describing the model' }]);
  const record = body as Record<string, unknown>;
  const issues: Issue[] = [];
  const name = readText(record['name'], '/name', 1, MODEL_LIMITS.name, issues, true);
  const description = readText(record['description'] ?? '', '/description', 0, MODEL_LIMITS.description, issues, false);
  const comment = readText(record['comment'] ?? '', '/comment', 0, MODEL_LIMITS.comment, issues, false);
  const tags = readTags(record['tags'] ?? [], issues);
  const plant = readPlant(record['plant'], issues);
  const compensator: Compensator | null = collect(issues, () => readCompensator(record['compensator'], '/compensator'));
  const design = readDesign(record['design'], issues);
  if (plant !== null && !issues.some((i) => i.pointer.startsWith('/compensator'))) checkLoop(plant, compensator, design, issues);
  if (issues.length > 0 || plant === null) throw new InputError(issues);
  return { name, description, tags, plant, compensator, design, comment };
}

function readText(value: unknown, pointer: string, min: number, max: number, issues: Issue[], required: boolean): string {
  if (value === undefined && required) {
    issues.push({ pointer, detail: 'is required' });
    return '';
  }
  if (typeof value !== 'string') {
    issues.push({ pointer, detail: 'must be a string' });
    return '';
  }
  const text = value.trim();
  if (text.length < min) issues.push({ pointer, detail: `must not be empty` });
  if (text.length > max) issues.push({ pointer, detail: `has ${text.length} characters; at most ${max}` });
  return text;
}

function readTags(value: unknown, issues: Issue[]): string[] {
  if (!Array.isArray(value)) {
    issues.push({ pointer: '/tags', detail: 'must be an array of tags such as "dead-time"' });
    return [];
  }
  if (value.length > MODEL_LIMITS.tags) issues.push({ pointer: '/tags', detail: `lists ${value.length} tags; at most ${MODEL_LIMITS.tags}` });
  const tags: string[] = [];
  value.forEach((tag: unknown, i) => {
    const text = typeof tag === 'string' ? tag.trim().toLowerCase() : '';
    if (!TAG.test(text) || text.length > MODEL_LIMITS.tagLength) {
      issues.push({ pointer: `/tags/${i}`, detail: `must be lowercase words joined by hyphens (a-z, 0-9), at most ${MODEL_LIMITS.tagLength} characters` });
    } else if (!tags.includes(text)) tags.push(text);
  });
  return tags;
}

function readPlant(value: unknown, issues: Issue[]): Plant | null {
  if (value === undefined) {
    issues.push({ pointer: '/plant', detail: 'is required' });
    return null;
  }
  if (collect(issues, () => normalizePlant(value, '/plant')) === null) return null;
  // keep only the fields the core reads, so that stored plants are exactly the core's plant form
  const source = value as Record<string, unknown>;
  const plant: Record<string, unknown> = {};
  for (const key of PLANT_KEYS) if (source[key] !== undefined) plant[key] = source[key];
  return plant as unknown as Plant;
}

function readDesign(value: unknown, issues: Issue[]): ModelDesign {
  if (value === undefined || value === null) return { gain: null, targets: null };
  if (typeof value !== 'object' || Array.isArray(value)) {
    issues.push({ pointer: '/design', detail: 'must be an object { "gain": number | null, "targets": {...} | null }' });
    return { gain: null, targets: null };
  }
  const record = value as Record<string, unknown>;
  const gain = record['gain'] ?? null;
  if (gain !== null && (typeof gain !== 'number' || !Number.isFinite(gain))) issues.push({ pointer: '/design/gain', detail: 'must be a finite number or null' });
  const targets = record['targets'] ?? null;
  if (targets !== null && (typeof targets !== 'object' || Array.isArray(targets))) issues.push({ pointer: '/design/targets', detail: 'must be an object of design targets or null' });
  return { gain: gain as number | null, targets: targets as DesignTargets | null };
}

/** The loop as a whole must be a plant the engine accepts; targets are checked by the engine itself. */
function checkLoop(plant: Plant, compensator: ModelInput['compensator'], design: ModelDesign, issues: Issue[]): void {
  try {
    const loop = loopPlant({ plant, compensator });
    if (compensator !== null) normalizePlant(loop, '/plant');
    if (design.targets !== null && !issues.some((i) => i.pointer.startsWith('/design'))) designGains({ plant: loop, targets: design.targets });
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    for (const issue of error.issues) {
      if (issue.pointer.startsWith('/targets')) issues.push({ pointer: `/design${issue.pointer}`, detail: issue.detail });
      else issues.push({ pointer: '/compensator', detail: `makes the loop (compensator × plant) unusable: ${issue.detail}` });
    }
  }
}

/** Runs one of the core's checks, its field issues collected with the others instead of thrown (null then). */
function collect<T>(issues: Issue[], check: () => T): T | null {
  try {
    return check();
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    issues.push(...error.issues);
    return null;
  }
}
