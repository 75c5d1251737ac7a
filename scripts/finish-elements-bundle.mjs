// Gives the element bundle its stable public name: Angular's application builder always calls the browser
// entry main.js, the contract (and every host page) loads dist/elements/polewright-elements.js.
// Fails when the build split the script into chunks, since a host page must need one script only.
import { existsSync, readFileSync, readdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const folder = 'dist/elements';
const main = join(folder, 'main.js');
if (!existsSync(main)) {
  console.error(`finish-elements-bundle: ${main} is missing; run ng build elements-bundle first`);
  process.exit(1);
}
const script = readFileSync(main, 'utf8').replace('sourceMappingURL=main.js.map', 'sourceMappingURL=polewright-elements.js.map');
writeFileSync(join(folder, 'polewright-elements.js'), script);
rmSync(main);
if (existsSync(`${main}.map`)) renameSync(`${main}.map`, join(folder, 'polewright-elements.js.map'));
// the builder writes an empty route list for applications; nothing serves it
rmSync(join(folder, 'prerendered-routes.json'), { force: true });
const chunks = readdirSync(folder).filter((name) => name.endsWith('.js') && name !== 'polewright-elements.js');
if (chunks.length > 0) {
  console.error(`finish-elements-bundle: the build produced extra scripts (${chunks.join(', ')}); keep the bundle to one script`);
  process.exit(1);
}
console.log(`finish-elements-bundle: ${folder}/polewright-elements.js, ${readdirSync(folder).join(', ')}`);
