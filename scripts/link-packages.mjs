// Makes the built libraries importable by package name from the repository root (plain Node ESM and
// the server import `@polewright/locus-core` exactly as an outside user would).
import { existsSync, lstatSync, mkdirSync, rmSync, symlinkSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const packages = [
  ['@polewright/locus-core', 'dist/locus-core'],
  ['@polewright/elements', 'dist/locus-elements'],
];

for (const [name, folder] of packages) {
  const target = join(root, folder);
  if (!existsSync(join(target, 'package.json'))) {
    console.error(`link-packages: ${folder} is not built yet; run npm run build first`);
    process.exit(1);
  }
  const link = join(root, 'node_modules', name);
  mkdirSync(dirname(link), { recursive: true });
  try {
    lstatSync(link);
    rmSync(link, { recursive: true, force: true });
  } catch {
    // nothing there yet
  }
  symlinkSync(relative(dirname(link), target), link, 'dir');
  console.log(`link-packages: ${name} -> ${folder}`);
}
