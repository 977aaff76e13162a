// Benchmark (a script, not a test): the JavaScript a first visit to each storefront page loads,
// gzipped, against the 120 kB budget. It builds the client into a temporary folder (never dist/),
// then follows the Vite manifest's static imports from index.html's entry and from the lazy chunks
// the router loads for the page (the shop layout and the page's route module). The budget holds for
// the pages a visitor lands on first (home, Green Lots, a lot); the others are shown for reference.
// Sizes in kB of 1000 bytes, as Vite reports them; gzip at level 9.
// Run: npm run bench:bundle   (exits 1 when a landing page is over budget)
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { build, type Manifest } from 'vite';

const budgetBytes = 120_000;
const projectRoot = fileURLToPath(new URL('../..', import.meta.url));
const shopLayout = 'src/app/layouts/shop-layout.tsx';

/** Each storefront page and the lazy route modules (src/app/router.tsx) a first visit to it loads. */
const pages: { page: string; routeModules: string[]; budgeted: boolean }[] = [
  { page: '/', routeModules: [shopLayout, 'src/app/routes/shop/home.tsx'], budgeted: true },
  { page: '/lots', routeModules: [shopLayout, 'src/app/routes/shop/lots.tsx'], budgeted: true },
  { page: '/lots/:code', routeModules: [shopLayout, 'src/app/routes/shop/lot.tsx'], budgeted: true },
  { page: '/roasting-basics', routeModules: [shopLayout, 'src/app/routes/shop/roasting-basics.tsx'], budgeted: false },
  { page: '/cart', routeModules: [shopLayout, 'src/app/routes/shop/cart.tsx'], budgeted: false },
  { page: '/checkout', routeModules: [shopLayout, 'src/app/routes/shop/checkout.tsx'], budgeted: false },
  { page: '/orders/:id', routeModules: [shopLayout, 'src/app/routes/shop/order.tsx'], budgeted: false },
];

function staticClosure(manifest: Manifest, keys: string[]): Set<string> {
  const seen = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    const chunk = manifest[key];
    if (!chunk) throw new Error(`${key} is not in the Vite manifest; is the route list above out of date?`);
    seen.add(key);
    for (const imported of chunk.imports ?? []) visit(imported);
  };
  keys.forEach(visit);
  return seen;
}

const kb = (bytes: number) => `${(bytes / 1000).toFixed(1)} kB`;

const outDir = mkdtempSync(path.join(tmpdir(), 'restday-bundle-'));
try {
  await build({
    root: projectRoot,
    logLevel: 'warn',
    mode: 'production',
    build: { outDir, emptyOutDir: true, manifest: true },
  });
  const manifest = JSON.parse(readFileSync(path.join(outDir, '.vite', 'manifest.json'), 'utf8')) as Manifest;
  const entry = Object.keys(manifest).find((key) => manifest[key]!.isEntry);
  if (!entry) throw new Error('The Vite manifest has no entry.');
  const gzipBytes = new Map<string, number>();
  const gzipOf = (file: string) => {
    if (!gzipBytes.has(file)) gzipBytes.set(file, gzipSync(readFileSync(path.join(outDir, file)), { level: 9 }).length);
    return gzipBytes.get(file)!;
  };

  let overBudget = 0;
  for (const { page, routeModules, budgeted } of pages) {
    const files = [...staticClosure(manifest, [entry, ...routeModules])]
      .map((key) => manifest[key]!.file)
      .filter((file) => file.endsWith('.js'))
      .sort((a, b) => gzipOf(b) - gzipOf(a));
    const total = files.reduce((sum, file) => sum + gzipOf(file), 0);
    const verdict = !budgeted ? 'for reference' : total <= budgetBytes ? `within the ${kb(budgetBytes)} budget` : `OVER the ${kb(budgetBytes)} budget`;
    if (budgeted && total > budgetBytes) overBudget += 1;
    console.log(`\n${page}: ${kb(total)} gzipped in ${files.length} files, ${verdict}`);
    for (const file of files) console.log(`  ${kb(gzipOf(file)).padStart(9)}  ${file}`);
  }
  console.log(overBudget === 0 ? '\nEvery landing page is within budget.' : `\n${overBudget} landing page(s) over budget.`);
  process.exitCode = overBudget === 0 ? 0 : 1;
} finally {
  rmSync(outDir, { recursive: true, force: true });
}
