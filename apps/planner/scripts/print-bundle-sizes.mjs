#!/usr/bin/env node
/**
 * Prints the gzipped size of every JavaScript and CSS chunk of the last `vite build`
 * (apps/planner/dist), then checks the budget of issue 5: the sign-in route and the app shell
 * together load at most 250 kB of gzipped JavaScript. Exits 1 when the budget is broken or the
 * build is missing.
 *
 * "Loaded" = the entry chunk and, for the sign-in route and the shell's layout route, each lazily
 * loaded module with everything it imports statically (Vite's build manifest lists the imports).
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const dist = join(root, 'dist');
const manifestPath = join(dist, '.vite', 'manifest.json');

/** Budget for sign-in route + shell, gzipped JavaScript, in kB of 1000 bytes (issue 5 item 8). */
const budgetKb = 250;
/** Route modules the first screen needs: the sign-in page and the signed-in shell. */
const firstScreenModules = ['src/app/routes/sign-in.tsx', 'src/app/routes/app/layout.tsx'];

if (!existsSync(manifestPath)) {
  console.error(`No build manifest at ${manifestPath}. Run \`npm run build -w apps/planner\` first.`);
  process.exit(1);
}
const manifest = JSON.parse(readFileSync(manifestPath, 'utf8'));

const gzipCache = new Map();
function sizes(file) {
  if (!gzipCache.has(file)) {
    const bytes = readFileSync(join(dist, file));
    gzipCache.set(file, { raw: bytes.length, gzip: gzipSync(bytes, { level: 9 }).length });
  }
  return gzipCache.get(file);
}
const kb = (n) => (n / 1000).toFixed(2).padStart(8);

/** The chunk of `key` and every chunk it imports statically, as file names. */
function closure(key, seen = new Set()) {
  const chunk = manifest[key];
  if (!chunk || seen.has(chunk.file)) return seen;
  seen.add(chunk.file);
  for (const imported of chunk.imports ?? []) closure(imported, seen);
  return seen;
}

const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
if (!entryKey) {
  console.error('The build manifest names no entry chunk.');
  process.exit(1);
}
for (const key of firstScreenModules) {
  if (!manifest[key]) {
    console.error(`The build manifest has no chunk for ${key}; is it still a lazily loaded route?`);
    process.exit(1);
  }
}

// Every chunk, largest first.
const files = new Set();
for (const chunk of Object.values(manifest)) {
  files.add(chunk.file);
  for (const css of chunk.css ?? []) files.add(css);
}
const rows = [...files]
  .filter((f) => f.endsWith('.js') || f.endsWith('.css'))
  .map((f) => ({ file: f, ...sizes(f) }))
  .sort((a, b) => b.gzip - a.gzip);

console.log('Planner bundle (apps/planner/dist), sizes in kB (1000 bytes):');
console.log(`${'raw'.padStart(8)} ${'gzip'.padStart(8)}  file`);
for (const r of rows) console.log(`${kb(r.raw)} ${kb(r.gzip)}  ${r.file}`);
const totalJs = rows.filter((r) => r.file.endsWith('.js')).reduce((s, r) => s + r.gzip, 0);
console.log(`${''.padStart(8)} ${kb(totalJs)}  all JavaScript together`);

const firstScreen = new Set();
closure(entryKey, firstScreen);
for (const key of firstScreenModules) closure(key, firstScreen);
const firstJs = [...firstScreen].filter((f) => f.endsWith('.js'));
const firstGzip = firstJs.reduce((s, f) => s + sizes(f).gzip, 0);

console.log('');
console.log(`Sign-in route + shell: ${firstJs.length} JavaScript chunks, ${(firstGzip / 1000).toFixed(2)} kB gzipped (budget ${budgetKb} kB):`);
for (const f of firstJs.sort()) console.log(`  ${kb(sizes(f).gzip)}  ${f}`);
if (firstGzip > budgetKb * 1000) {
  console.error(`Over budget by ${((firstGzip - budgetKb * 1000) / 1000).toFixed(2)} kB.`);
  process.exit(1);
}
console.log('Within budget.');
