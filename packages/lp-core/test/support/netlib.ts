/**
 * Netlib LP test problems as shipped by Debian (coinor-libcoinutils-dev, /usr/share/coin/Data/Sample)
 * and the table of published optima for the Netlib LP collection reproduced by Debian's glpk-doc
 * (/usr/share/doc/glpk-doc/netlib.txt.gz). fetch-netlib.sh puts both into a git-ignored cache.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gunzipSync } from 'node:zlib';
import { readMps } from '../../src/mps/read-mps';
import type { Problem } from '../../src/problem/problem';

const here = dirname(fileURLToPath(import.meta.url));

let cachedRoot: string | undefined;

/** Extraction root of the two Debian packages (fetched on first use). */
export function netlibRoot(): string {
  if (cachedRoot) return cachedRoot;
  const out = execFileSync(join(here, 'fetch-netlib.sh'), { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  cachedRoot = out.trim().split('\n').pop()!;
  return cachedRoot;
}

/** The MPS text of one Netlib sample (plain or gzipped). */
export function netlibMps(name: string): string {
  const base = join(netlibRoot(), 'usr/share/coin/Data/Sample', name);
  if (existsSync(`${base}.mps`)) return readFileSync(`${base}.mps`, 'utf8');
  if (existsSync(`${base}.mps.gz`)) return gunzipSync(readFileSync(`${base}.mps.gz`)).toString('utf8');
  throw new Error(`Netlib sample ${name} not found under ${base}(.mps|.mps.gz)`);
}

export interface NetlibTableEntry {
  rows: number;
  cols: number;
  nonzeros: number;
  optimum: number;
}

/** Parses the glpk-doc table: "Problem Rows Cols Nonz Optimum Iters Time Mem" lines. */
export function netlibTable(): Map<string, NetlibTableEntry> {
  const text = gunzipSync(readFileSync(join(netlibRoot(), 'usr/share/doc/glpk-doc/netlib.txt.gz'))).toString('utf8');
  const table = new Map<string, NetlibTableEntry>();
  for (const line of text.split('\n')) {
    const m = /^([a-z0-9-]+)\s+(\d+)\s+(\d+)\s+(\d+)\s+([+-]\d\.\d+e[+-]\d+)\s/.exec(line);
    if (m) table.set(m[1], { rows: +m[2], cols: +m[3], nonzeros: +m[4], optimum: Number(m[5]) });
  }
  if (table.size === 0) throw new Error('netlib.txt.gz: no table lines found');
  return table;
}

export const NETLIB_PROBLEMS = ['afiro', 'brandy', 'e226', 'finnis'] as const;

/** the four problems read with lp-core's MPS reader, and the published table (fetched on first use) */
export function loadNetlib(): { table: Map<string, NetlibTableEntry>; problems: Map<string, Problem> } {
  const problems = new Map<string, Problem>();
  for (const name of NETLIB_PROBLEMS) problems.set(name, readMps(netlibMps(name)));
  return { table: netlibTable(), problems };
}
