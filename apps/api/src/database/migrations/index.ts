import { Init1764633600000 } from './1764633600000-Init.js';

/** Every migration, in order. Imported explicitly so the app, the CLI and Jest share one list. */
export const migrations = [Init1764633600000];
