/**
 * Client benchmark, figures only (no assertions):
 *  1. Initial bundle transfer size: the files the production build's index.html loads before the
 *     first screen (stylesheet, modulepreload chunks, main script) in dist/client/browser, each
 *     gzipped with node:zlib (level 9), against the 300 kB target.
 *  2. Time to draw a 100 000-point trace in the spectrum chart's configuration of uPlot (trace,
 *     mask line with its tinted region, ringed worst point) in headless Chromium: performance.now
 *     around a synchronous uPlot batch of setData + redraw and a pixel read that forces the
 *     raster, median and worst of repeated draws,
 *     against the 150 ms target. A small page of our own loads uPlot's browser build, so the
 *     figure is uPlot's drawing alone, not the app's start-up.
 *
 *   npx ng build --configuration production && node node_modules/tsx/dist/cli.mjs bench/client.ts
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { chromium } from 'playwright-core';

const ROOT = path.resolve(__dirname, '..');
const DIST = path.join(ROOT, 'dist', 'client', 'browser');
const TARGET_TRANSFER_KB = 300;
const TARGET_DRAW_MS = 150;
const POINTS = 100_000;
const DRAWS = 15;

/** Files index.html loads up front: stylesheets, module preloads and scripts, in page order. */
function initialFiles(indexHtml: string): string[] {
  const refs = [...indexHtml.matchAll(/<(?:link[^>]+href|script[^>]+src)="([^"]+)"/g)].map((m) => m[1]);
  return refs.filter((f) => /\.(js|css)$/.test(f) && !/^https?:/.test(f));
}

function bundleFigures() {
  const index = path.join(DIST, 'index.html');
  if (!fs.existsSync(index)) throw new Error(`${index} is missing: run the production build first`);
  const files = initialFiles(fs.readFileSync(index, 'utf8')).map((name) => {
    const bytes = fs.readFileSync(path.join(DIST, name));
    return { name, rawBytes: bytes.length, gzipBytes: zlib.gzipSync(bytes, { level: 9 }).length };
  });
  return { files, rawBytes: files.reduce((n, f) => n + f.rawBytes, 0), gzipBytes: files.reduce((n, f) => n + f.gzipBytes, 0) };
}

/** Runs inside the page: builds the chart as sc-spectrum-chart configures it and times the draws. */
function drawInPage(args: { points: number; draws: number }): { firstMs: number; drawsMs: number[] } {
  type Plot = { batch(fn: () => void): void; setData(d: unknown[]): void; scales: Record<string, { max?: number }>; ctx: CanvasRenderingContext2D };
  // Chromium records canvas commands and rasterizes them later; reading a pixel forces the raster
  // inside the timing, so the figure is the real cost of the pixels, not just of issuing commands.
  const settle = (p: Plot) => p.ctx.getImageData(0, 0, 1, 1);
  const UPlot = (window as unknown as { uPlot: new (opts: object, data: unknown[], el: HTMLElement) => Plot }).uPlot;
  const n = args.points;
  const trace = (seed: number) => {
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const limit: (number | null)[] = new Array(n);
    for (let i = 0; i < n; i++) {
      const offset = -12_000 + (i * 25_000) / n;
      x[i] = 2_182_000 + offset;
      // Two tones and their products over a noisy floor (deterministic pseudo-noise).
      const noise = Math.sin(i * 12.9898 + seed) * 43758.5453;
      let mw = 10 ** (-4 + 0.2 * (noise - Math.floor(noise)));
      for (const [f, dbm] of [[600, 40], [1400, 40], [-200, 10], [2200, 10]]) mw += 10 ** (dbm / 10) * Math.exp(-0.5 * ((offset - f) / 15) ** 2);
      y[i] = 10 * Math.log10(mw);
      const a = Math.abs(offset);
      limit[i] = a < 1500 ? null : a <= 4500 ? 15 : a <= 7500 ? 8 : -20;
    }
    return [x, y, limit];
  };
  const el = document.getElementById('chart')!;
  const worst = Math.round((14_200 * n) / 25_000);
  const opts = {
    width: 1100,
    height: 320,
    cursor: { drag: { x: true, y: false, setScale: true } },
    scales: { x: { time: false }, y: { auto: true } },
    series: [
      {},
      { label: 'Measured', stroke: '#0d5c63', width: 1, points: { show: false, size: 11, width: 2.5, stroke: '#b3261e', fill: '#f4d35e', filter: () => [worst] } },
      { label: 'Limit', stroke: '#b3261e', width: 1.5, dash: [6, 4], spanGaps: false, fill: 'rgba(179, 38, 30, 0.07)', fillTo: (u: Plot) => u.scales['y'].max ?? 0, points: { show: false } },
    ],
  };
  const datasets = Array.from({ length: args.draws + 1 }, (_, k) => trace(k));
  let t = performance.now();
  const plot = new UPlot(opts, [[], [], []], el);
  plot.batch(() => plot.setData(datasets[0]));
  settle(plot);
  const firstMs = performance.now() - t;
  const drawsMs: number[] = [];
  for (let k = 1; k <= args.draws; k++) {
    t = performance.now();
    plot.batch(() => plot.setData(datasets[k]));
    settle(plot);
    drawsMs.push(performance.now() - t);
  }
  return { firstMs, drawsMs };
}

async function drawFigures(points = POINTS, draws = DRAWS) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-bench-client-'));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    await page.setContent('<!doctype html><html><body><div id="chart"></div></body></html>');
    await page.addStyleTag({ path: path.join(ROOT, 'node_modules', 'uplot', 'dist', 'uPlot.min.css') });
    await page.addScriptTag({ path: path.join(ROOT, 'node_modules', 'uplot', 'dist', 'uPlot.iife.min.js') });
    // tsx compiles with esbuild's keepNames, which wraps named functions in a __name() helper that
    // the page does not have: give it an identity one before sending drawInPage across.
    await page.evaluate('globalThis.__name = (fn) => fn');
    const { firstMs, drawsMs } = await page.evaluate(drawInPage, { points, draws });
    const sorted = [...drawsMs].sort((a, b) => a - b);
    return { firstMs, medianMs: sorted[Math.floor(sorted.length / 2)], worstMs: sorted[sorted.length - 1] };
  } finally {
    await context.close();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  const bundle = bundleFigures();
  const kb = (bytes: number) => (bytes / 1000).toFixed(2);
  console.log('Initial bundle (dist/client/browser, gzip level 9 with node:zlib):');
  for (const f of bundle.files) console.log(`  ${f.name.padEnd(28)} ${kb(f.rawBytes).padStart(9)} kB raw ${kb(f.gzipBytes).padStart(8)} kB gzip`);
  console.log(`  total transfer ${kb(bundle.gzipBytes)} kB (raw ${kb(bundle.rawBytes)} kB); target ≤ ${TARGET_TRANSFER_KB} kB`);
  const draw = await drawFigures();
  console.log(`Spectrum chart, ${POINTS.toLocaleString('en-GB')} points + mask line, headless Chromium (software rendering):`);
  console.log(`  first chart (create + draw) ${draw.firstMs.toFixed(1)} ms`);
  console.log(`  setData + redraw: median ${draw.medianMs.toFixed(1)} ms, worst ${draw.worstMs.toFixed(1)} ms of ${DRAWS}; target ≤ ${TARGET_DRAW_MS} ms`);
  // How drawing grows with the trace: 10,000 (1x), 100,000 (10x, the target) and 1,000,000 points (100x).
  const growth: { points: number; medianMs: number }[] = [];
  for (const points of process.argv.includes('--quick') ? [10_000, 100_000] : [10_000, 100_000, 1_000_000]) {
    growth.push({ points, medianMs: Number((await drawFigures(points, 5)).medianMs.toFixed(1)) });
  }
  console.log('  growth (setData + redraw, median of 5): ' + growth.map((g) => `${g.points.toLocaleString('en-GB')} points ${g.medianMs} ms`).join(' · '));
  console.log(JSON.stringify({ growth, bench: 'client', initialTransferKb: Number(kb(bundle.gzipBytes)), targetTransferKb: TARGET_TRANSFER_KB, drawPoints: POINTS, firstDrawMs: Number(draw.firstMs.toFixed(1)), drawMedianMs: Number(draw.medianMs.toFixed(1)), drawWorstMs: Number(draw.worstMs.toFixed(1)), targetDrawMs: TARGET_DRAW_MS }));
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
