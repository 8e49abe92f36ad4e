import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The import rules of DESIGN.md, kept by a test rather than by hand:
 * lp-core imports nothing of ours; plan-model imports lp-core only; contracts import nothing
 * of ours; the API imports plan-model, lp-core and contracts; the planner imports contracts
 * only (and reaches the API over HTTP); inside the planner, features never import each other.
 */
const repo = resolve(__dirname, '../..');

const allowed: Record<string, string[]> = {
  'packages/lp-core': [],
  'packages/plan-model': ['@millrace/lp-core'],
  'packages/contracts': [],
  'apps/api': ['@millrace/plan-model', '@millrace/lp-core', '@millrace/contracts'],
  'apps/planner': ['@millrace/contracts'],
};

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir)) {
    if (entry === 'node_modules' || entry === 'dist') continue;
    const path = join(dir, entry);
    if (statSync(path).isDirectory()) out.push(...sourceFiles(path));
    else if (/\.(ts|tsx|mts)$/.test(entry)) out.push(path);
  }
  return out;
}

function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const specs: string[] = [];
  const pattern = /(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)|^\s*import\s*['"]([^'"]+)['"]/gm;
  for (const match of text.matchAll(pattern)) specs.push(match[1] ?? match[2] ?? match[3]);
  return specs;
}

describe('import boundaries (DESIGN.md "The packages and apps")', () => {
  for (const [workspace, permitted] of Object.entries(allowed)) {
    it(`when ${workspace} imports one of our packages, then it is one it may use`, () => {
      const root = join(repo, workspace);
      const offences: string[] = [];
      for (const file of sourceFiles(root)) {
        for (const spec of importsOf(file)) {
          if (spec.startsWith('@millrace/') && !permitted.includes(spec)) {
            offences.push(`${relative(repo, file)} imports ${spec}`);
          }
          // relative imports must stay inside the workspace
          if (spec.startsWith('.')) {
            const target = resolve(file, '..', spec);
            if (!target.startsWith(root)) offences.push(`${relative(repo, file)} reaches outside with ${spec}`);
          }
        }
      }
      expect(offences).toEqual([]);
    });
  }

  it('when a planner feature imports, then never from another feature', () => {
    const featuresRoot = join(repo, 'apps/planner/src/features');
    let features: string[] = [];
    try {
      features = readdirSync(featuresRoot).filter((f) => statSync(join(featuresRoot, f)).isDirectory());
    } catch {
      features = [];
    }
    const offences: string[] = [];
    for (const feature of features) {
      for (const file of sourceFiles(join(featuresRoot, feature))) {
        for (const spec of importsOf(file)) {
          const target = spec.startsWith('.') ? resolve(file, '..', spec) : spec;
          const m = /apps\/planner\/src\/features\/([^/]+)/.exec(target) ?? /^@\/features\/([^/]+)/.exec(spec);
          if (m && m[1] !== feature) offences.push(`${relative(repo, file)} imports feature ${m[1]}`);
        }
      }
    }
    expect(offences).toEqual([]);
  });
});
