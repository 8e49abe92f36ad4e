/** A malformed MPS file: names the 1-based line and what was expected there. */
export class MpsParseError extends Error {
  readonly line: number;

  constructor(line: number, detail: string) {
    super(`MPS line ${line}: ${detail}`);
    this.name = 'MpsParseError';
    this.line = line;
  }
}
