/**
 * `npm run bench`: model speed in Node, interaction and load in Chromium on
 * the production build, and Quiescent side by side with ngspice. Writes
 * bench/results.json and prints a table with each budget. Not a test: it
 * never fails a build; a missed budget is printed as such.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { existsSync } from 'node:fs';
import { benchBrowser, type BrowserResults } from './browser.mts';
import { benchModel } from './model.mts';
import { benchNgspice, RELAXED_VNTOL, type SpiceRow } from './ngspice.mts';
import { ms, type Stats } from './stats.mts';
import { ngspiceAvailable } from '../tests/spice/ngspice';

const line = (label: string, s: Stats, budget?: { value: number; on: 'median' | 'p95' }) => {
  const verdict = budget ? (s[budget.on] <= budget.value ? `  within ${budget.on} budget ${ms(budget.value)}` : `  MISSES ${budget.on} budget ${ms(budget.value)}`) : '';
  const runs = s.p95Runs ? `, p95 of each run ${s.p95Runs.map((x) => x.toFixed(1)).join(' / ')}` : '';
  console.log(`${label.padEnd(44)} median ${ms(s.median).padStart(10)}  p95 ${ms(s.p95).padStart(10)}  (min ${ms(s.min)}, max ${ms(s.max)}, n=${s.n}${runs})${verdict}`);
};

console.log('\nModel (Node)');
const model = benchModel();
line('solveStage', model.solveStage);
line('full one-stage analysis', model.fullAnalysis, { value: 2, on: 'median' });
line('four-stage amplifier, whole analysis', model.fourStageChain, { value: 8, on: 'median' });
line('  its global feedback across the band', model.loopFigures);
line('supply, three sections, to steady state', model.supplyThreeSections, { value: 50, on: 'median' });
line('four-stage amplifier on that supply', model.amplifierOnSupply);
line('  again after a change, from its steady state', model.amplifierOnSupplyWarm);
line('  a drag frame, along the supply\'s tangent', model.amplifierOnSupplyDragFrame, { value: 8, on: 'p95' });
line('push-pull pair, one cycle at 128 points', model.pushPullCycle);
line('push-pull pair, light (per drag frame)', model.pushPullLight, { value: 2, on: 'median' });
line('push-pull amplifier (LTP → EL84s), whole', model.pushPullAmplifier);
line('plate-curve family (sheet)', model.plateFamily);
line('fit of 200 points', model.fit200, { value: 300, on: 'median' });
for (const [n, s] of Object.entries(model.fftScaling)) line(`  full analysis, FFT of ${n} points`, s);
line('output stage, light (per drag frame)', model.outputLight);
line('output stage, full (with both sweeps)', model.outputFull);
line('target region, coarse 30 × 20 (first look)', model.regionCoarse, { value: 100, on: 'median' });
line('target region, full 60 × 40', model.regionFull, { value: 300, on: 'median' });
line('  one point of it (one solve, every target)', model.regionPoint, { value: 0.5, on: 'median' });
line('every library tube ranked against targets', model.rankLibrary, { value: 1000, on: 'median' });
line('output stage region, coarse 30 × 20', model.outputRegionCoarse, { value: 100, on: 'median' });
line('output stage region, full 60 × 40', model.outputRegionFull, { value: 300, on: 'median' });
line('push-pull pair region, coarse 30 × 20', model.pairRegionCoarse, { value: 100, on: 'median' });
line('push-pull pair region, full 60 × 40', model.pairRegionFull, { value: 300, on: 'median' });
line('every output tube ranked against targets', model.rankOutputs, { value: 1000, on: 'median' });

let browser: BrowserResults | null = null;
if (existsSync('/usr/bin/chromium')) {
  console.log('\nInteraction and load (Chromium, production build)');
  browser = await benchBrowser();
  line('drag, first 320 moves after loading (cold)', browser.dragColdStart, { value: 8, on: 'p95' });
  line('drag, one tube (move to frame ready)', browser.dragOneTube, { value: 8, on: 'p95' });
  line('drag, two tubes compared', browser.dragTwoTubes, { value: 8, on: 'p95' });
  line('typing a new Ra', browser.typingRa, { value: 8, on: 'p95' });
  line('drag, output stage', browser.dragOutput, { value: 8, on: 'p95' });
  line('drag, stage 2 of four, cold (fresh loads)', browser.dragChainColdStart, { value: 8, on: 'p95' });
  line('drag, stage 2 of four, steady', browser.dragChain, { value: 8, on: 'p95' });
  line('drag, its follower on the bench, steady', browser.dragFollower, { value: 8, on: 'p95' });
  line('drag, output stage, two tubes compared', browser.dragOutputTwoTubes, { value: 8, on: 'p95' });
  line('drag, push-pull pair behind its splitter', browser.dragPushPull, { value: 8, on: 'p95' });
  for (const [n, s] of Object.entries(browser.dragByCurveCount)) line(`  drag with up to ${n} curves`, s);
  line('navigation to first plate curve', browser.firstCurveMs, { value: 1500, on: 'median' });
  line('target changed: region first shown (coarse)', browser.regionFirstPaint, { value: 100, on: 'median' });
  line('target changed: region complete (60 × 40)', browser.regionFullPaint, { value: 300, on: 'median' });
  line('output stage: region first shown (coarse)', browser.outputRegionFirstPaint, { value: 100, on: 'median' });
  line('output stage: region complete (60 × 40)', browser.outputRegionFullPaint, { value: 300, on: 'median' });
  line('push-pull pair: region first shown (coarse)', browser.pairRegionFirstPaint, { value: 100, on: 'median' });
  line('push-pull pair: region complete (60 × 40)', browser.pairRegionFullPaint, { value: 300, on: 'median' });
  console.log(`${'production JS, gzipped'.padEnd(44)} ${(browser.jsGzipBytes / 1024).toFixed(1)} kB  ${browser.jsGzipBytes <= 200 * 1024 ? 'within' : 'MISSES'} budget 200 kB`);
  console.log(`${'production CSS, gzipped'.padEnd(44)} ${(browser.cssGzipBytes / 1024).toFixed(1)} kB`);
  console.log('\nLongest main-thread task for inputs that once froze the page (budget 200 ms; "50" means none over 50 ms)');
  for (const [what, msLongest] of Object.entries(browser.heavyInputs)) {
    console.log(`${`  ${what}`.padEnd(44)} ${Number.isNaN(msLongest) ? 'not measured' : `${msLongest.toFixed(0)} ms  ${msLongest <= 200 ? 'within' : 'MISSES'} budget 200 ms`}`);
  }
} else {
  console.log('\n!!! Chromium is missing (sudo apt-get install -y chromium): interaction and load not measured.');
}

let spice: SpiceRow[] | null = null;
if (ngspiceAvailable()) {
  console.log('\nSide by side with ngspice (operating point, gain, H2 and H3 of one drive level)');
  const side = benchNgspice();
  spice = side.rows;
  for (const f of side.failed) console.log(`!!! ${f.design}: ngspice could not finish: ${f.reason}; left out of the figures below.`);
  console.log(`${'design'.padEnd(34)} ${'ours'.padStart(10)} ${'ngspice'.padStart(11)} ${'ratio'.padStart(7)}   Va err  gain err  H2 err  H3 err`);
  for (const r of spice) {
    console.log(`${r.design.padEnd(34)} ${ms(r.oursMs).padStart(10)} ${ms(r.ngspiceMs).padStart(11)} ${`${Math.round(r.ratio)}×`.padStart(7)}   ${r.vaErrPercent.toFixed(3)} %  ${r.gainErrPercent.toFixed(3)} %  ${r.h2ErrDb.toFixed(2)} dB  ${r.h3ErrDb.toFixed(2)} dB`);
  }
  const slowest = Math.min(...spice.map((r) => r.ratio));
  const worst = { va: Math.max(...spice.map((r) => r.vaErrPercent)), gain: Math.max(...spice.map((r) => r.gainErrPercent)), h2: Math.max(...spice.map((r) => r.h2ErrDb)), h3: Math.max(...spice.map((r) => r.h3ErrDb)) };
  const median = [...spice.map((r) => r.ratio)].sort((a, b) => a - b)[Math.floor(spice.length / 2)]!;
  if (spice.some((r) => r.design.endsWith('†'))) console.log(`† ngspice's time step collapsed with its default node tolerance: run again with vntol ${RELAXED_VNTOL} V`);
  console.log(`median speed-up ${Math.round(median)}× (${median >= 1000 ? 'reaches' : 'MISSES'} the 1,000× goal)`);
  console.log(`least speed-up ${Math.round(slowest)}× (${slowest >= 100 ? 'within' : 'MISSES'} budget 100×; ${slowest >= 1000 ? 'reaches' : 'short of'} the 1,000× goal); largest disagreement: Va ${worst.va.toFixed(3)} %, gain ${worst.gain.toFixed(3)} %, H2 ${worst.h2.toFixed(2)} dB, H3 ${worst.h3.toFixed(2)} dB`);
} else {
  console.log('\n!!! ngspice is missing (sudo apt-get install -y ngspice): no side-by-side run.');
}

mkdirSync('bench', { recursive: true });
writeFileSync('bench/results.json', JSON.stringify({ date: new Date().toISOString(), machine: `${process.platform} ${process.arch}, node ${process.version}`, model, browser, spice }, null, 2));
console.log('\nWrote bench/results.json');
