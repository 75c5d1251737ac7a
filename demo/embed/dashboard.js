// Commissioning dashboard of the embedding demo (Quillfield Conveyor Works, an invented company): two saved
// loops, the line 3 belt drive at light and at full load, held at ONE speed gain. Plain browser JavaScript;
// the pw- elements come from /elements/polewright-elements.js. The page reads only what the elements send
// (pw-gain-change) and what its embed token may read (the models and their loci).

/** Short labels of the demo loops, by their scenario key (demo/scenario.json), as a noun and as an adjective. */
const LOAD_LABELS = { 'line3-belt-speed': 'Light load', 'line3-belt-speed-full-load': 'Full load' };
const LOAD_ADJECTIVES = { 'line3-belt-speed': 'light-load', 'line3-belt-speed-full-load': 'full-load' };

// the elements show figures with four significant digits; the readout uses the same, so both read alike
const figure = new Intl.NumberFormat('en-US', { maximumSignificantDigits: 4 });
const fmt = (x) => (Number.isFinite(x) ? figure.format(x) : '—');

const $ = (id) => document.getElementById(id);

/** A problem+json answer (or any failed response) as one readable sentence. */
async function problemText(response) {
  try {
    const body = await response.json();
    const said = [body.title, body.detail].filter(Boolean).join(': ');
    if (said) return `${said} (${response.status})`;
  } catch {
    // not JSON: fall through to the status line
  }
  return `HTTP ${response.status} ${response.statusText}`.trim();
}

/** GET a JSON resource, or throw an Error whose message says what the server answered. */
async function getJson(url, headers, what) {
  let response;
  try {
    response = await fetch(url, { headers: { Accept: 'application/json', ...headers } });
  } catch (error) {
    throw new Error(`${what}: the server could not be reached (${error.message}).`);
  }
  if (!response.ok) throw new Error(`${what}: ${await problemText(response)}`);
  return response.json();
}

/** Whether K lies inside one of the engine's stable gain ranges (open intervals, `to: null` unbounded). */
function isStableAt(ranges, k) {
  return ranges.some((r) => r.from < k && (r.to === null || k < r.to));
}

/** The gains stable for every loop: the intersection of their stable ranges. */
function commonRanges(rangeLists) {
  return rangeLists.reduce((common, ranges) =>
    common.flatMap((a) =>
      ranges
        .map((b) => ({ from: Math.max(a.from, b.from), to: a.to === null ? b.to : b.to === null ? a.to : Math.min(a.to, b.to) }))
        .filter((r) => r.to === null || r.to > r.from),
    ),
  );
}

function rangeText(r) {
  return r.to === null ? `K > ${fmt(r.from)}` : `${fmt(r.from)} < K < ${fmt(r.to)}`;
}

/** The limit nearest to K inside its stable range, as a gain and a factor (×). */
function nearestLimit(ranges, k) {
  const range = ranges.find((r) => r.from < k && (r.to === null || k < r.to));
  if (!range) return null;
  const limits = [];
  if (range.to !== null) limits.push({ gain: range.to, ratio: range.to / k });
  if (range.from > 0) limits.push({ gain: range.from, ratio: k / range.from });
  return limits.sort((a, b) => a.ratio - b.ratio)[0] ?? null;
}

function element(tag, attributes) {
  const node = document.createElement(tag);
  for (const [name, value] of Object.entries(attributes)) if (value !== undefined && value !== null) node.setAttribute(name, String(value));
  return node;
}

/** Puts a loop's gain to `k` through every element of that loop (setGain once upgraded, else the property). */
function applyGain(elements, k) {
  for (const node of elements) {
    if (typeof node.setGain === 'function') node.setGain(k);
    else node.gain = k;
  }
}

/** Shows a problem above the dashboard; `connected: false` also says so in the header. */
function showPageMessage(text, connected = false) {
  const box = $('page-message');
  box.textContent = text;
  box.hidden = false;
  if (!connected) $('session-state').textContent = 'not connected';
}

/** One card per loop: the name from the API, its saved gain and band, and the three elements side by side. */
function loopCard(loop, session, gain) {
  const card = element('article', { class: 'panel loop', 'aria-labelledby': `title-${loop.key}`, 'data-loop': loop.key });
  const head = document.createElement('header');
  head.className = 'loop-head';
  const titles = document.createElement('div');
  const eyebrow = element('p', { class: 'eyebrow' });
  eyebrow.textContent = LOAD_LABELS[loop.key] ?? loop.key;
  const title = element('h2', { id: `title-${loop.key}`, class: 'loop-title' });
  title.textContent = loop.model.name;
  titles.append(eyebrow, title);
  const status = element('span', { class: 'chip', id: `chip-${loop.key}` });
  head.append(titles, status);

  const facts = element('dl', { class: 'loop-facts' });
  const saved = loop.model.design?.gain;
  for (const [term, value] of [
    ['Saved design gain', Number.isFinite(saved) ? `K = ${fmt(saved)}` : 'none'],
    ['Stable for', loop.ranges.length ? loop.ranges.map(rangeText).join(' or ') : 'no positive gain'],
    ['Model revision', `r${loop.model.revision}`],
  ]) {
    const row = document.createElement('div');
    const dt = document.createElement('dt');
    const dd = document.createElement('dd');
    dt.textContent = term;
    dd.textContent = value;
    row.append(dt, dd);
    facts.append(row);
  }

  const common = { loop: loop.key };
  const plot = element('pw-locus-plot', {
    ...common,
    id: `plot-${loop.key}`,
    'model-id': loop.id,
    'api-base': session.apiBase,
    token: session.token,
    gain,
    label: `Root locus, ${loop.model.name}`,
  });
  const step = element('pw-step-plot', { ...common, id: `step-${loop.key}` });
  const summary = element('pw-stability-summary', { ...common, id: `summary-${loop.key}` });
  const grid = element('div', { class: 'loop-grid' });
  grid.append(plot, step, summary);
  card.append(head, facts, grid);
  loop.elements = [plot, step, summary];
  return card;
}

/** Writes the plain-HTML verdict for gain k: per loop and for both. */
function renderReadout(loops, common, k) {
  $('readout-gain').textContent = `K = ${fmt(k)}`;
  const both = loops.every((l) => isStableAt(l.ranges, k));
  const chip = $('readout-both');
  chip.textContent = both ? 'yes' : 'no';
  chip.className = `chip ${both ? 'stable' : 'unstable'}`;
  const list = $('readout-loops');
  list.replaceChildren(
    ...loops.map((loop) => {
      const stable = isStableAt(loop.ranges, k);
      const limit = nearestLimit(loop.ranges, k);
      const item = element('li', { class: stable ? 'stable' : 'unstable' });
      const name = element('strong', {});
      name.textContent = LOAD_LABELS[loop.key] ?? loop.model.name;
      const rest = stable
        ? limit
          ? ` stable · limit K = ${fmt(limit.gain)}, margin ×${fmt(limit.ratio)}`
          : ' stable · no limit above or below'
        : ' NOT stable at this gain';
      item.append(name, rest);
      const cardChip = $(`chip-${loop.key}`);
      cardChip.textContent = stable ? `stable at K = ${fmt(k)}` : `not stable at K = ${fmt(k)}`;
      cardChip.className = `chip ${stable ? 'stable' : 'unstable'}`;
      return item;
    }),
  );
  $('readout-band').textContent = common.length
    ? `Stable on both loads for ${common.map(rangeText).join(' or ')}.`
    : 'No positive gain is stable on both loads.';
}

async function start() {
  let session;
  try {
    session = await getJson('/embed-demo/session', {}, 'The demo could not get its embed token');
  } catch (error) {
    showPageMessage(`${error.message} The plots need a Polewright server with the seeded demo.`);
    return;
  }
  const auth = { Authorization: `Bearer ${session.token}` };
  const api = session.apiBase.replace(/\/+$/, '');
  let loops;
  try {
    loops = await Promise.all(
      session.loops.map(async (loop) => {
        const [model, locus] = await Promise.all([
          getJson(`${api}/v1/models/${encodeURIComponent(loop.id)}`, auth, `Reading the model “${loop.name}”`),
          getJson(`${api}/v1/models/${encodeURIComponent(loop.id)}/locus`, auth, `Reading the locus of “${loop.name}”`),
        ]);
        return { ...loop, model, ranges: locus.stableGainRanges, caution: locus.caution };
      }),
    );
  } catch (error) {
    showPageMessage(error.message);
    return;
  }
  const until = new Date(session.expiresAt);
  $('session-state').textContent = `${loops.length} saved models, embed token valid until ${until.toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}`;
  if (loops[0]?.caution) $('caution-text').textContent = loops[0].caution;

  const common = commonRanges(loops.map((l) => l.ranges));
  // start from the gain commissioned at light load: does it hold with heavy pallets on the belt?
  const saved = loops[0]?.model.design?.gain;
  let gain = Number.isFinite(saved) && saved > 0 ? saved : 1;

  $('loops').replaceChildren(...loops.map((loop) => loopCard(loop, session, gain)));

  // the slider track colours one loop's stretches: the loop whose stable gains are exactly the common ones
  const sameRanges = (a, b) => a.length === b.length && a.every((r, i) => r.from === b[i].from && r.to === b[i].to);
  const trackLoop = loops.find((l) => sameRanges(l.ranges, common)) ?? loops[loops.length - 1];
  // slider ends at whole decades around the common limit: two decades below it, the unstable stretch above
  const upper = common.length ? common[common.length - 1].to : null;
  const decade = (x, round) => 10 ** round(Math.log10(x));
  const control = element('pw-gain-control', {
    id: 'shared-gain',
    loop: trackLoop.key,
    gain,
    label: 'Speed gain K',
    min: upper !== null ? decade(upper / 100, Math.floor) : null,
    max: upper !== null ? decade(upper * 3, Math.ceil) : null,
  });
  $('gain-slot').replaceChildren(control);
  trackLoop.elements.push(control);
  $('track-note').textContent =
    `Track colours: the ${LOAD_ADJECTIVES[trackLoop.key] ?? `“${trackLoop.model.name}”`} loop` +
    (sameRanges(trackLoop.ranges, common) ? ', the narrower band (green is stable on both).' : ' only; the verdict covers both.') +
    ' Dragging or arrow keys on either plot move both loops too.';

  renderReadout(loops, common, gain);
  document.addEventListener('pw-gain-change', (event) => {
    const { gain: k, loop: key } = event.detail;
    if (!loops.some((l) => l.key === key) || !(k > 0)) return;
    gain = k;
    for (const other of loops) if (other.key !== key) applyGain(other.elements, k);
    renderReadout(loops, common, k);
  });
  document.addEventListener('pw-load-error', (event) => showPageMessage(`An element could not load its model: ${event.detail.message}`, true));
  document.body.dataset.ready = 'true';
}

start();
