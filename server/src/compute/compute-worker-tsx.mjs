// Entry of a compute worker when the server runs from its TypeScript sources (Vitest, `node --import tsx`):
// a worker thread does not inherit the parent's loader hooks (and `execArgv: ['--import', 'tsx']` does not
// take effect in a worker on Node 20), so this thread registers tsx itself, then loads the worker. The
// built server (dist/server) loads compute-worker.js directly and never uses this file.
import { register } from 'tsx/esm/api';

register();
await import('./compute-worker.ts');
