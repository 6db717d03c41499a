import { readFileSync } from 'node:fs';

/** Fluxtrail's version as released (package.json), named in every pack so a reader knows what built it. */
export const appVersion: string = (JSON.parse(readFileSync(new URL('../../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
