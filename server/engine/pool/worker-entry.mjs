// Plain-JS entry of the simulation worker: registers tsx's loader in this thread, then loads the
// TypeScript worker. Works the same under tsx, vitest and plain node.
import { register } from 'tsx/esm/api';

register();
await import('./simulation-worker.ts');
