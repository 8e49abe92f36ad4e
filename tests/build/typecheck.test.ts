import { spawnSync } from 'node:child_process';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

/** Every workspace type-checks (tsc -b over the project references of the top tsconfig.json). */
const repo = resolve(__dirname, '../..');

describe('type check', () => {
  it('when every workspace is type-checked, then tsc reports no errors', () => {
    const run = spawnSync(process.execPath, [join(repo, 'node_modules/typescript/bin/tsc'), '-b'], {
      cwd: repo,
      encoding: 'utf8',
    });
    expect(run.stdout + run.stderr).toBe('');
    expect(run.status).toBe(0);
  }, 600_000);
});
