/** The HiGHS WebAssembly runtime (npm package `highs`), for tests that read files with HiGHS's own parser. */
import highsLoader from 'highs';

let runtime: ReturnType<typeof highsLoader> | undefined;

export function highs(): ReturnType<typeof highsLoader> {
  runtime ??= highsLoader();
  return runtime;
}
