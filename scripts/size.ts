/**
 * `npm run size`: the JavaScript the first page loads, gzip-compressed, from the build in dist/client (run
 * `npm run build` first). Starts from the entry scripts of index.html and follows their static imports (not the
 * dynamic `import()` of lazily loaded screens and of the plotting chunk); each file counts once. Prints the
 * figure, the largest files, and the lazy chunks for reference; exits 1 when the first page exceeds the budget.
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";

const BUDGET_KB = 300;
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const dist = path.join(root, "dist", "client");

const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} kB`;
const gzipSize = (file: string) => gzipSync(readFileSync(file), { level: 9 }).length;

/** Static `import … from "./x.js"`, `import "./x.js"` and `export … from "./x.js"`; not `import("./x.js")`. */
const STATIC_IMPORT = /\b(?:import|export)\s*(?:[^"'();]*?\bfrom\s*)?["']([^"']+\.js)["']/g;

function staticGraph(entries: string[]): Set<string> {
  const seen = new Set<string>();
  const queue = [...entries];
  while (queue.length > 0) {
    const file = queue.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    const code = readFileSync(file, "utf8");
    for (const match of code.matchAll(STATIC_IMPORT)) {
      const spec = match[1];
      const target = spec.startsWith("/") ? path.join(dist, spec) : path.resolve(path.dirname(file), spec);
      if (existsSync(target)) queue.push(target);
    }
  }
  return seen;
}

function main(): number {
  const html = path.join(dist, "index.html");
  if (!existsSync(html)) {
    console.error("dist/client/index.html not found: run `npm run build` first.");
    return 2;
  }
  const page = readFileSync(html, "utf8");
  const entries = [...page.matchAll(/<script[^>]*type="module"[^>]*src="([^"]+)"/g), ...page.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"/g)]
    .map((m) => path.join(dist, m[1]));
  const css = [...page.matchAll(/<link[^>]*rel="stylesheet"[^>]*href="([^"]+)"/g)].map((m) => path.join(dist, m[1]));
  if (entries.length === 0) {
    console.error("No entry script found in dist/client/index.html.");
    return 2;
  }
  const first = [...staticGraph(entries)];
  const sizes = first.map((file) => ({ file: path.relative(dist, file), gzip: gzipSize(file) })).sort((a, b) => b.gzip - a.gzip);
  const total = sizes.reduce((sum, s) => sum + s.gzip, 0);

  console.log(`First page JavaScript (entry + static imports, gzip -9): ${kb(total)} in ${sizes.length} files (budget ${BUDGET_KB} kB)`);
  for (const s of sizes.slice(0, 8)) console.log(`  ${kb(s.gzip).padStart(9)}  ${s.file}`);
  const cssTotal = css.reduce((sum, f) => sum + gzipSize(f), 0);
  if (css.length > 0) console.log(`First page CSS (gzip): ${kb(cssTotal)}`);

  const assets = path.join(dist, "assets");
  const lazy = readdirSync(assets)
    .filter((f) => f.endsWith(".js"))
    .map((f) => path.join(assets, f))
    .filter((f) => !first.includes(f))
    .map((f) => ({ file: path.relative(dist, f), gzip: gzipSize(f) }))
    .sort((a, b) => b.gzip - a.gzip);
  console.log(`Loaded later (lazy routes, plots, worker): ${lazy.length} files, ${kb(lazy.reduce((s, l) => s + l.gzip, 0))}; largest:`);
  for (const l of lazy.slice(0, 5)) console.log(`  ${kb(l.gzip).padStart(9)}  ${l.file}`);

  if (total > BUDGET_KB * 1024) {
    console.error(`Over budget by ${kb(total - BUDGET_KB * 1024)}.`);
    return 1;
  }
  return 0;
}

process.exit(main());
