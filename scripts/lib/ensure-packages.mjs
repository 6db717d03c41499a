// Installs npm packages when missing (so lint and typecheck can run before `npm test` would).
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureNodeModules } from './deps.mjs';

ensureNodeModules(resolve(fileURLToPath(new URL('../..', import.meta.url))));
