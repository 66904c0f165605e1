// Worker entry of the core fuzz runs: registers tsx in this thread, then loads the TypeScript worker it was given.
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
await import(workerData.entry);
