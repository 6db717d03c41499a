// The pack's zip thread starts here. A worker thread does not get the loader hooks that
// `node --import tsx` gave the thread that started it (Node 20), so it registers tsx itself
// before loading its TypeScript module.
import { register } from 'tsx/esm/api';

register();
await import('./pack-zip-worker.ts');
