// Running the library from its TypeScript sources (tests, benches): the worker thread registers the
// TypeScript loader before loading the worker module. The built package uses monte-carlo-worker.js.
import { register } from 'tsx/esm/api';

register();
await import('./monte-carlo-worker.ts');
