/**
 * Reads the JSON written by Vitest's json reporter and prints the totals of every suite. The last
 * line is always exactly `N passed, N failed` (CI reads it). Exit status 0 when nothing failed,
 * 1 otherwise.
 *
 *   node --import tsx tests/support/print-test-summary.ts RESULTS.json VITEST_EXIT_STATUS [--extra-failure TEXT]...
 *
 * Counted as failures besides failed tests: a test file that failed to run (import or hook error,
 * no failed test inside), every --extra-failure (e.g. the planner build), and a non-zero Vitest
 * exit with no failure counted otherwise (unhandled errors, timeout). A missing or unreadable
 * results file gives `0 passed, 1 failed`.
 */
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

interface AssertionResult {
  status: string;
  fullName?: string;
  title?: string;
}
interface FileResult {
  name: string;
  status: string;
  message?: string;
  assertionResults?: AssertionResult[];
}
interface VitestJson {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests?: number;
  numTodoTests?: number;
  testResults?: FileResult[];
}

export interface Summary {
  lines: string[];
  passed: number;
  failed: number;
  exitCode: 0 | 1;
}

export function summarize(resultsText: string | undefined, vitestStatus: number, extraFailures: string[], root = process.cwd()): Summary {
  const lines: string[] = [];
  let results: VitestJson | undefined;
  if (resultsText === undefined) {
    lines.push(`Vitest wrote no results file (exit status ${vitestStatus}): it crashed or never started.`);
  } else {
    try {
      const parsed = JSON.parse(resultsText) as VitestJson;
      if (typeof parsed.numPassedTests === 'number' && typeof parsed.numFailedTests === 'number') results = parsed;
      else lines.push('The Vitest results file lacks numPassedTests/numFailedTests.');
    } catch (cause) {
      lines.push(`The Vitest results file is not valid JSON: ${(cause as Error).message}`);
    }
  }
  if (!results) {
    lines.push('0 passed, 1 failed');
    return { lines, passed: 0, failed: 1, exitCode: 1 };
  }

  const passed = results.numPassedTests;
  let failed = results.numFailedTests;
  const skipped = (results.numPendingTests ?? 0) + (results.numTodoTests ?? 0);
  const failedNames: string[] = [];
  for (const file of results.testResults ?? []) {
    const relative = path.relative(root, file.name) || file.name;
    const failedInFile = (file.assertionResults ?? []).filter((a) => a.status === 'failed');
    for (const a of failedInFile) failedNames.push(`${relative} › ${a.fullName ?? a.title ?? '(unnamed)'}`);
    if (file.status === 'failed' && failedInFile.length === 0) {
      failed += 1;
      const reason = (file.message ?? '').split('\n').find((l) => l.trim() !== '') ?? 'no message';
      failedNames.push(`${relative} (the file failed to run: ${reason.trim()})`);
    }
  }
  for (const extra of extraFailures) {
    failed += 1;
    failedNames.push(extra);
  }
  if (vitestStatus !== 0 && failed === 0) {
    failed = 1;
    failedNames.push(
      vitestStatus === 124
        ? 'Vitest was stopped by the time limit (MILLRACE_TEST_TIMEOUT)'
        : `Vitest exited with status ${vitestStatus} although no test failed (an unhandled error; see its output above)`,
    );
  }
  if (failedNames.length > 0) {
    lines.push('', 'Failed:');
    for (const name of failedNames.slice(0, 100)) lines.push(`  ✗ ${name}`);
    if (failedNames.length > 100) lines.push(`  … and ${failedNames.length - 100} more`);
  }
  lines.push('', `${skipped} skipped`);
  lines.push(`${passed} passed, ${failed} failed`);
  return { lines, passed, failed, exitCode: failed > 0 ? 1 : 0 };
}

function main(argv: string[]): void {
  const [resultsPath, statusText, ...rest] = argv;
  const extras: string[] = [];
  for (let i = 0; i < rest.length; i++) {
    if (rest[i] === '--extra-failure' && rest[i + 1] !== undefined) extras.push(rest[++i]);
    else throw new Error(`Unknown argument "${rest[i]}"; expected --extra-failure TEXT.`);
  }
  const status = Number(statusText ?? '1');
  const text = resultsPath && existsSync(resultsPath) ? readFileSync(resultsPath, 'utf8') : undefined;
  const summary = summarize(text, Number.isInteger(status) ? status : 1, extras);
  process.stdout.write(`${summary.lines.join('\n')}\n`);
  process.exitCode = summary.exitCode;
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  main(process.argv.slice(2));
}
