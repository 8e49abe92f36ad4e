/**
 * The command line, spawned as integrators run it (`npm run -s lp-core -- solve FILE.mps --json`
 * from the repository root). Expected optima: the Netlib table in Debian's glpk-doc (afiro), and the
 * Wyndor Glass LP of Hillier & Lieberman, Introduction to Operations Research (36).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';
import { netlibMps, netlibRoot, netlibTable } from './support/netlib';

const repoRoot = resolve(__dirname, '../../..');
const mainTs = join(repoRoot, 'packages/lp-core/src/cli/main.ts');
const run = (args: string[]) => spawnSync(process.execPath, ['--import', 'tsx', mainTs, ...args], { cwd: repoRoot, encoding: 'utf8', timeout: 120_000 });

const WYNDOR = `NAME          WYNDOR
OBJSENSE
    MAX
ROWS
 N  profit
 L  plant1
 L  plant2
 L  plant3
COLUMNS
    doors     profit         3.0   plant1         1.0
    doors     plant3         3.0
    windows   profit         5.0   plant2         2.0
    windows   plant3         2.0
RHS
    rhs       plant1         4.0   plant2        12.0
    rhs       plant3        18.0
ENDATA
`;

let dir: string;
let afiro: string;
beforeAll(() => {
  netlibRoot();
  dir = mkdtempSync(join(tmpdir(), 'lp-core-cli-'));
  writeFileSync(join(dir, 'wyndor.mps'), WYNDOR);
  writeFileSync(join(dir, 'wyndor.mps.gz'), gzipSync(WYNDOR));
  writeFileSync(join(dir, 'broken.mps'), WYNDOR.replace(' L  plant2', ' Q  plant2'));
  afiro = join(dir, 'afiro.mps');
  writeFileSync(afiro, netlibMps('afiro'));
}, 120_000);

describe('lp-core solve … --json', () => {
  it('npm run -s lp-core -- solve afiro.mps --json prints exactly one JSON line with the certificate', () => {
    const out = spawnSync('npm', ['run', '-s', 'lp-core', '--', 'solve', afiro, '--json'], { cwd: repoRoot, encoding: 'utf8', timeout: 120_000 });
    expect(out.status).toBe(0);
    const lines = out.stdout.trim().split('\n');
    expect(lines).toHaveLength(1);
    const report = JSON.parse(lines[0]);
    for (const key of ['status', 'objective', 'iterations', 'seconds', 'primalResidual', 'dualResidual', 'relativeGap']) expect(report).toHaveProperty(key);
    expect(report.status).toBe('optimal');
    const published = netlibTable().get('afiro')!.optimum;
    expect(Math.abs(report.objective - published) / Math.abs(published)).toBeLessThanOrEqual(1e-6);
  });

  it.each(['ipm', 'barrier'])('--solver %s solves the Wyndor Glass LP (maximise) to 36', (solver) => {
    const out = run(['solve', join(dir, 'wyndor.mps'), '--json', '--solver', solver]);
    expect(out.status).toBe(0);
    const report = JSON.parse(out.stdout);
    expect(report.solver).toBe(solver);
    expect(report.status).toBe('optimal');
    expect(report.objective).toBeCloseTo(36, 6);
  });

  it('reads gzipped files', () => {
    const out = run(['solve', join(dir, 'wyndor.mps.gz'), '--json']);
    expect(out.status).toBe(0);
    expect(JSON.parse(out.stdout).objective).toBeCloseTo(36, 6);
  });

  it('prints a readable summary without --json', () => {
    const out = run(['solve', join(dir, 'wyndor.mps')]);
    expect(out.status).toBe(0);
    expect(out.stdout).toMatch(/status\s+optimal/);
    expect(out.stdout).toMatch(/objective\s+36/);
    expect(out.stdout).toMatch(/relative gap/);
  });
});

describe('bad arguments and files exit with code 2 and a clear message', () => {
  it.each([
    [['solve'], /missing FILE\.mps/],
    [['optimise', 'x.mps'], /unknown command 'optimise'/],
    [['solve', 'x.mps', '--solver', 'simplex'], /--solver must be ipm or barrier, got 'simplex'/],
    [['solve', 'x.mps', '--time-limit', '-3'], /--time-limit must be a positive number/],
    [['solve', 'x.mps', '--fast'], /unknown option '--fast'/],
  ])('%j', (args, message) => {
    const out = run(args as string[]);
    expect(out.status).toBe(2);
    expect(out.stderr).toMatch(message);
    expect(out.stdout).toBe('');
  });

  it('an unreadable file', () => {
    const out = run(['solve', join(dir, 'missing.mps'), '--json']);
    expect(out.status).toBe(2);
    expect(out.stderr).toMatch(/cannot read .*missing\.mps/);
  });

  it('a malformed file names the line', () => {
    const out = run(['solve', join(dir, 'broken.mps'), '--json']);
    expect(out.status).toBe(2);
    expect(out.stderr).toMatch(/broken\.mps: MPS line 7: expected a row type N, E, L or G, found 'Q'/);
  });
});
