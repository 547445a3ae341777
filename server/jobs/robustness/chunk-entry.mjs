// Plain-JS entry of a robustness-chunk thread: registers tsx's loader in this thread, then loads the
// TypeScript thread body. Works the same under tsx, vitest and plain node.
import { register } from 'tsx/esm/api';

register();
await import('./chunk-thread.ts');
