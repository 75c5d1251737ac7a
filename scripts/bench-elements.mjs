// Browser benchmark of the pw- custom elements (npm run bench:elements, after npm run build): Debian
// Chromium driven by playwright-core, figures from performance marks inside the page. Prints figures and
// the targets next to them; asserts nothing.
//   - frame time while dragging the gain slider, and while dragging a compensator zero on the editable
//     plot, on a degree-10 loop laid out in pw-loop-studio (plot, gain control, step, poles, summary):
//     input event → every element updated and laid out (script, change detection, style, layout; paint
//     not included), median and p90 over the drag;
//   - time from the script having loaded to the first plot on a plain page (median of several loads);
//   - gzip size of polewright-elements.js.
import { existsSync, readFileSync, statSync } from 'node:fs';
import { createServer } from 'node:http';
import { extname, join, normalize, resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright-core';

const FOLDER = resolve('dist/elements');
const SCRIPT = join(FOLDER, 'polewright-elements.js');
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const TYPES = { '.html': 'text/html; charset=utf-8', '.js': 'text/javascript', '.css': 'text/css', '.woff2': 'font/woff2', '.woff': 'font/woff' };

// an invented degree-10 loop: nine plant poles (an integrator, a slow lag, three lightly damped pairs
// and two fast lags) and two zeros, with a lead compensator (zero at −1.5, pole at −25) in series
const DEGREE_10 = {
  plant: {
    zeros: [{ re: -3, im: 2 }, { re: -3, im: -2 }],
    poles: [
      { re: 0, im: 0 }, { re: -0.8, im: 0 }, { re: -2, im: 4 }, { re: -2, im: -4 },
      { re: -5, im: 0 }, { re: -7, im: 1.5 }, { re: -7, im: -1.5 }, { re: -12, im: 0 }, { re: -15, im: 0 },
    ],
    gain: 400,
  },
  compensator: { zeros: [{ re: -1.5, im: 0 }], poles: [{ re: -25, im: 0 }], gain: 1 },
};
const BELT = '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))';

const pages = new Map();
pages.set(
  '/bench-drag.html',
  page(`<pw-loop-studio id="studio" editable gain="2" model='${JSON.stringify(DEGREE_10)}'></pw-loop-studio>`),
);
pages.set(
  '/bench-first-plot.html',
  page(`<pw-locus-plot id="plot" model="${BELT}" style="height: 400px"></pw-locus-plot>`, `
    <script>
      (function watch() {
        const plot = document.getElementById('plot');
        if (plot && plot.shadowRoot && plot.shadowRoot.querySelector('path.pw-branch')) performance.mark('first-plot');
        else requestAnimationFrame(watch);
      })();
    </script>`),
);

function page(body, tail = '') {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><link rel="icon" href="data:,">
<link rel="stylesheet" href="/polewright-elements.css"><script type="module" src="/polewright-elements.js"></script>
<style>body { margin: 12px; width: 1200px; }</style></head><body>${body}${tail}</body></html>`;
}

function serve() {
  const server = createServer((request, response) => {
    const path = decodeURIComponent(new URL(request.url ?? '/', 'http://localhost').pathname);
    if (pages.has(path)) {
      response.writeHead(200, { 'Content-Type': TYPES['.html'], 'Cache-Control': 'no-store' });
      return response.end(pages.get(path));
    }
    const file = normalize(join(FOLDER, path));
    if (!file.startsWith(FOLDER) || !existsSync(file) || !statSync(file).isFile()) {
      response.writeHead(404);
      return response.end();
    }
    response.writeHead(200, { 'Content-Type': TYPES[extname(file)] ?? 'application/octet-stream', 'Cache-Control': 'no-store' });
    response.end(readFileSync(file));
  });
  return new Promise((done) => server.listen(0, '127.0.0.1', () => done(server)));
}

// records, for every pointer move, the time from the event to the end of the update it caused: the
// nested timeout runs after the change detection Angular schedules while the event is handled
const RECORDER = () => {
  window.benchFrames = [];
  let n = 0;
  window.addEventListener(
    'pointermove',
    (event) => {
      if (!window.benchRecording) return;
      const id = ++n;
      performance.mark(`move-${id}`);
      setTimeout(() => setTimeout(() => {
        document.getElementById('studio')?.shadowRoot?.querySelector('.studio')?.getBoundingClientRect();
        window.benchFrames.push(performance.measure(`frame-${id}`, `move-${id}`).duration);
      }), 0);
    },
    { capture: true },
  );
};

async function nextFrame(p) {
  await p.evaluate(() => new Promise((done) => requestAnimationFrame(() => setTimeout(done, 0))));
}

async function drag(p, from, to, steps) {
  await p.mouse.move(from.x, from.y);
  await p.mouse.down();
  await p.evaluate(() => {
    window.benchFrames = [];
    window.benchRecording = true;
  });
  for (let i = 1; i <= steps; i++) {
    const t = i / steps;
    await p.mouse.move(from.x + (to.x - from.x) * t, from.y + (to.y - from.y) * t);
    await nextFrame(p);
  }
  await nextFrame(p);
  await p.mouse.up();
  return p.evaluate(() => {
    window.benchRecording = false;
    return window.benchFrames;
  });
}

async function center(locator) {
  const box = await locator.boundingBox();
  if (!box) throw new Error('bench-elements: element to drag not found on the page');
  return { x: box.x + box.width / 2, y: box.y + box.height / 2, box };
}

function stats(values) {
  const sorted = [...values].sort((a, b) => a - b);
  const at = (q) => sorted[Math.min(sorted.length - 1, Math.floor(q * (sorted.length - 1) + 0.5))];
  return { n: sorted.length, median: at(0.5), p90: at(0.9), max: sorted[sorted.length - 1] };
}

const ms = (v) => `${v.toFixed(1)} ms`;

async function main() {
  if (!existsSync(SCRIPT)) {
    console.error('bench-elements: dist/elements/polewright-elements.js is missing; run npm run build first');
    process.exit(1);
  }
  const server = await serve();
  const base = `http://127.0.0.1:${server.address().port}`;
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ARGS, headless: true });
  const results = {};
  try {
    // dragging: one page, the studio on the degree-10 loop
    const p = await browser.newPage({ viewport: { width: 1240, height: 1100 } });
    const errors = [];
    p.on('pageerror', (e) => errors.push(String(e)));
    await p.addInitScript(RECORDER);
    await p.goto(`${base}/bench-drag.html`);
    await p.evaluate(() => customElements.whenDefined('pw-loop-studio'));
    const studio = p.locator('#studio');
    await studio.locator('pwl-locus-plot path.pw-branch').first().waitFor();
    const degree = await p.evaluate(() => document.querySelector('#studio').shadowRoot.querySelector('pwl-locus-plot').shadowRoot.querySelectorAll('path.pw-branch').length);

    const slider = studio.locator('pwl-gain-control input[type=range]');
    const { box } = await center(slider);
    const fraction = (Number(await slider.inputValue()) - 0) / Number(await slider.getAttribute('max'));
    const thumb = { x: box.x + 8 + fraction * (box.width - 16), y: box.y + box.height / 2 };
    const before = await studio.locator('pwl-gain-control input.field').inputValue();
    const gainFrames = await drag(p, thumb, { x: box.x + box.width * 0.85, y: thumb.y }, 80);
    const after = await studio.locator('pwl-gain-control input.field').inputValue();
    results.gain = { ...stats(gainFrames), note: `gain ${before} → ${after}` };

    const zero = studio.locator('pwl-locus-plot g[data-compensator="zero"]:not(.pw-mirror)').first();
    const start = await center(zero);
    const editsBefore = await p.evaluate(() => (window.benchEdits ??= 0));
    await p.evaluate(() =>
      document.addEventListener('pw-model-edit', (e) => {
        window.benchEdits = (window.benchEdits ?? 0) + 1;
        window.benchZero = e.detail.compensator?.zeros?.[0]?.re;
      }),
    );
    const zeroFrames = await drag(p, start, { x: start.x - 90, y: start.y }, 80);
    const edits = (await p.evaluate(() => window.benchEdits ?? 0)) - editsBefore;
    const zeroAt = await p.evaluate(() => window.benchZero);
    results.zero = { ...stats(zeroFrames), note: `${edits} pw-model-edit event(s), compensator zero −1.5 → ${typeof zeroAt === 'number' ? zeroAt.toPrecision(4) : 'unchanged'}` };
    results.degree = degree;
    results.errors = errors;
    await p.close();

    // first plot: fresh page loads, nothing cached
    const firstPlot = [];
    const fromNavigation = [];
    for (let run = 0; run < 7; run++) {
      const context = await browser.newContext();
      const q = await context.newPage();
      await q.goto(`${base}/bench-first-plot.html`);
      await q.waitForFunction(() => performance.getEntriesByName('first-plot').length > 0, null, { timeout: 20000 });
      const t = await q.evaluate(() => {
        const script = performance.getEntriesByType('resource').find((e) => e.name.endsWith('/polewright-elements.js'));
        const mark = performance.getEntriesByName('first-plot')[0].startTime;
        return { fromScript: mark - script.responseEnd, fromNavigation: mark };
      });
      firstPlot.push(t.fromScript);
      fromNavigation.push(t.fromNavigation);
      await context.close();
    }
    results.firstPlot = stats(firstPlot);
    results.firstPlotNavigation = stats(fromNavigation);
  } finally {
    await browser.close();
    server.close();
  }

  const script = readFileSync(SCRIPT);
  const gzip = gzipSync(script, { level: 9 }).length;
  const css = gzipSync(readFileSync(join(FOLDER, 'polewright-elements.css')), { level: 9 }).length;
  const line = (label, value, target) => console.log(`${label.padEnd(46)} ${value.padEnd(34)} ${target}`);
  console.log(`bench-elements: Chromium ${ARGS[0]}, bundle built ${statSync(SCRIPT).mtime.toISOString()}, loop of degree ${results.degree}`);
  line('figure', 'measured', 'target');
  line('frame while dragging the gain (median / p90)', `${ms(results.gain.median)} / ${ms(results.gain.p90)} (n=${results.gain.n})`, '≤ 16 ms median');
  line('frame while dragging a zero (median / p90)', `${ms(results.zero.median)} / ${ms(results.zero.p90)} (n=${results.zero.n})`, '≤ 16 ms median');
  line('first plot after the script loaded (median)', `${ms(results.firstPlot.median)} (max ${ms(results.firstPlot.max)})`, '≤ 500 ms');
  line('first plot after navigation start (median)', ms(results.firstPlotNavigation.median), '');
  line('polewright-elements.js gzip', `${(gzip / 1024).toFixed(1)} KB (${(script.length / 1024).toFixed(0)} KB raw)`, '≤ 250 KB');
  line('polewright-elements.css gzip', `${(css / 1024).toFixed(1)} KB`, '');
  console.log(`drag checks: ${results.gain.note}; ${results.zero.note}; page errors: ${results.errors.length}`);
  for (const e of results.errors) console.log(`  page error: ${e}`);
}

await main();
