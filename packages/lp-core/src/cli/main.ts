/**
 * lp-core command line. From the repository root:
 *   npm run -s lp-core -- solve FILE.mps --json
 * Exit codes: 0 = the solve ran and was reported (whatever its status), 2 = bad arguments,
 * unreadable or malformed file, invalid problem data.
 */
import { CliUsageError, USAGE, parseCliArguments } from './cli-arguments';
import { reportAsJson, reportAsText } from './format-report';
import { CliInputError, solveFile } from './solve-file';

const EXIT_USAGE = 2;

function main(argv: string[]): number {
  try {
    const command = parseCliArguments(argv);
    if (command.command === 'help') {
      process.stdout.write(`${USAGE}\n`);
      return 0;
    }
    const report = solveFile(command);
    process.stdout.write(`${command.json ? reportAsJson(report) : reportAsText(report)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof CliUsageError) {
      process.stderr.write(`lp-core: ${error.message}\n${USAGE}\n`);
      return EXIT_USAGE;
    }
    if (error instanceof CliInputError) {
      process.stderr.write(`lp-core: ${error.message}\n`);
      return EXIT_USAGE;
    }
    throw error;
  }
}

process.exitCode = main(process.argv.slice(2));
