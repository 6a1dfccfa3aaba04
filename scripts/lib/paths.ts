import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** Absolute paths, so the scripts work from any working directory. */
export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const DATA_DIR = path.join(ROOT, '.data');
/** Pid files of the children the start scripts spawn, so `npm run stop` can find leftovers. */
export const RUN_DIR = path.join(DATA_DIR, 'run');
export const BIN = (name: string) => path.join(ROOT, 'node_modules', '.bin', name);

// A local `.env` (see .env.example) fills in settings; variables already set win.
const envFile = path.join(ROOT, '.env');
if (existsSync(envFile)) process.loadEnvFile(envFile);
