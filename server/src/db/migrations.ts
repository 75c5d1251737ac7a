/*
 * Every migration, in order of their timestamps (platform from 1766000000000, models from 1767000000000).
 * Listed explicitly rather than globbed so that the same list works from sources (tests) and dist.
 */
import type { MigrationInterface } from 'typeorm';
import { PlatformTables1766000000000 } from './migrations/1766000000000-platform-tables.js';
import { Models1767000000000 } from './migrations/1767000000000-models.js';

/** All migration classes. */
export const MIGRATIONS: (new () => MigrationInterface)[] = [
  PlatformTables1766000000000,
  Models1767000000000,
];
