import { createHash } from 'node:crypto';
import type { LoopParts } from '@polewright/locus-core';

/**
 * JSON with object keys sorted at every level, so that equal content always gives equal text.
 * Example: canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] }) = '{"a":[2,{"c":4,"d":3}],"b":1}'.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v === undefined ? null : v)).join(',')}]`;
  const record = value as Record<string, unknown>;
  const keys = Object.keys(record).filter((k) => record[k] !== undefined).sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(record[k])}`).join(',')}}`;
}

/** SHA-256 (hex) of the canonical plant + compensator content: the key of the locus cache. */
export function contentHash(parts: LoopParts): string {
  return createHash('sha256').update(canonicalJson({ plant: parts.plant, compensator: parts.compensator })).digest('hex');
}
