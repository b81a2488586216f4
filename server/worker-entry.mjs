// Worker entry when the server runs from its TypeScript sources (node --import tsx, vitest):
// Node 20 does not apply the parent's loader hooks to a worker's entry, so register tsx here and
// then load the worker proper. A compiled build (dist/) starts bootstrap-worker.js directly.
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
