/** Starts the real server on a fresh database file for one browser-test run. */
import { rmSync } from 'node:fs';

const dir = process.env.DATA_DIR ?? '.tmp/e2e';
rmSync(dir, { recursive: true, force: true });
process.env.DATABASE_FILE = `${dir}/ringcall.sqlite`;
process.env.DATA_DIR = dir;
process.env.LOG_REQUESTS = 'off';
process.env.DEMO_SEED = process.env.DEMO_SEED ?? 'on';
await import('../../../server/index');
