// Size budget of the first visit: the JavaScript the sign-in page needs, gzip-compressed, at most 250 KB.
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

const BUDGET_KB = 250;
const dist = new URL('../dist/', import.meta.url).pathname;
const html = readFileSync(join(dist, 'index.html'), 'utf8');
const firstRoute = readdirSync(join(dist, 'assets')).find((name) => /^sign-in-[\w-]+\.js$/.test(name));

/** A chunk and every chunk it imports statically (dynamic imports load later, on demand). */
function closure(files, seen = new Set()) {
  for (const file of files) {
    if (seen.has(file)) continue;
    seen.add(file);
    const code = readFileSync(join(dist, file), 'utf8');
    const imports = [...code.matchAll(/(?:^|[;\n}])\s*import\s*(?:[\w*{}\s,$]+from\s*)?["'](\.\/[^"']+\.js)["']/g)].map((m) =>
      join('assets', m[1]),
    );
    closure(imports, seen);
  }
  return seen;
}

const eager = [...html.matchAll(/(?:src|href)="\/(assets\/[^"]+\.js)"/g)].map((m) => m[1]);
const files = closure([...eager, ...(firstRoute ? [join('assets', firstRoute)] : [])]);
const bytes = [...files].reduce((sum, file) => sum + gzipSync(readFileSync(join(dist, file))).length, 0);
const kb = bytes / 1024;
console.log(`First visit (sign-in page): ${files.size} JavaScript files, ${kb.toFixed(1)} KB gzip; budget ${BUDGET_KB} KB.`);
if (!firstRoute) throw new Error('The sign-in page chunk was not found in dist/assets.');
if (kb > BUDGET_KB) {
  console.error(`Over the size budget by ${(kb - BUDGET_KB).toFixed(1)} KB: load more of it lazily.`);
  process.exit(1);
}
