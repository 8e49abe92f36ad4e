import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * Issue 5 item 8: the sign-in route and the app shell load at most 250 kB of gzipped JavaScript.
 * The budget script reads the manifest of the planner build that the test command makes first.
 */
const repo = resolve(__dirname, '../..');
const dist = join(repo, 'apps/planner/dist');

describe('planner bundle budget', () => {
  it.skipIf(!existsSync(join(dist, '.vite', 'manifest.json')))(
    'when the planner is built, then sign-in plus shell stay within 250 kB gzipped',
    () => {
      const run = spawnSync(process.execPath, [join(repo, 'apps/planner/scripts/print-bundle-sizes.mjs')], { encoding: 'utf8' });
      expect(run.status, run.stdout + run.stderr).toBe(0);
    },
  );
});
