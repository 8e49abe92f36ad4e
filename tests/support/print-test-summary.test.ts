import { execFile } from 'node:child_process';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { summarize } from './print-test-summary';

// The input is produced by Vitest's own json reporter (a reference outside this project) over a
// fixture suite with known outcomes: 2 passed, 1 failed, 1 skipped, 1 todo, and 1 file that
// fails to load. CI reads only the last line, which must be exactly "N passed, N failed".

const run = promisify(execFile);
const here = path.dirname(fileURLToPath(import.meta.url));
const repo = path.resolve(here, '../..');

describe('test summary (the last line of ./docker-free-start.sh test)', () => {
  let dir: string;
  let resultsText: string;
  let vitestStatus = 0;

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'millrace-summary-'));
    const out = path.join(dir, 'results.json');
    try {
      await run(
        process.execPath,
        [
          path.join(repo, 'node_modules/vitest/vitest.mjs'),
          'run',
          '--config',
          path.join(here, 'summary-fixture/vitest.config.ts'),
          '--reporter=json',
          `--outputFile.json=${out}`,
        ],
        { cwd: repo, env: { ...process.env, CI: '1' } },
      );
    } catch (error) {
      vitestStatus = (error as { code?: number }).code ?? 1;
    }
    resultsText = await readFile(out, 'utf8');
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it('when Vitest reports a failed test and a file that failed to load, then both count and the last line says so', () => {
    expect(vitestStatus).toBe(1);
    const summary = summarize(resultsText, vitestStatus, [], repo);
    expect(summary.lines.at(-1)).toBe('2 passed, 2 failed');
    expect(summary.lines.at(-2)).toBe('2 skipped');
    expect(summary.exitCode).toBe(1);
    const text = summary.lines.join('\n');
    expect(text).toContain('outcomes.fixture.ts › fails on purpose');
    expect(text).toContain('load-error.fixture.ts (the file failed to run: fixture: this file fails to load)');
  });

  it('when the planner build failed besides, then it adds one failure', () => {
    const summary = summarize(resultsText, vitestStatus, ['the planner build failed'], repo);
    expect(summary.lines.at(-1)).toBe('2 passed, 3 failed');
  });

  it('when Vitest wrote no results or garbage, then the last line is "0 passed, 1 failed"', () => {
    expect(summarize(undefined, 1, []).lines.at(-1)).toBe('0 passed, 1 failed');
    expect(summarize('{"not":"vitest"}', 0, []).lines.at(-1)).toBe('0 passed, 1 failed');
    expect(summarize('{', 0, []).exitCode).toBe(1);
  });

  it('when every test passed but Vitest exited non-zero, then one failure is counted', () => {
    const allPassed = JSON.stringify({ numPassedTests: 7, numFailedTests: 0, testResults: [] });
    expect(summarize(allPassed, 0, []).lines.at(-1)).toBe('7 passed, 0 failed');
    expect(summarize(allPassed, 0, []).exitCode).toBe(0);
    expect(summarize(allPassed, 1, []).lines.at(-1)).toBe('7 passed, 1 failed');
    expect(summarize(allPassed, 124, []).lines.join('\n')).toContain('time limit');
  });
});
