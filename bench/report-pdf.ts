/**
 * Benchmark: generation + signing of a 20-page test report (10 figures of 1,000 points each,
 * tables), warm (median after warm-up runs in this process) and fresh (a new node process running
 * this script with --fresh-child). Prints figures beside the targets and one JSON line.
 *
 *   node node_modules/tsx/dist/cli.mjs bench/report-pdf.ts [--quick]
 *
 * The lab's key is generated once, outside the timings: a lab signs with a stored key.
 */
import { spawnSync } from 'node:child_process';
import { generateLabSigningIdentity } from '../server/signing/generate-lab-signing-identity';
import type { LabSigningIdentity } from '../server/signing/lab-signing-identity';
import { sha256Hex } from '../server/signing/sha256-hex';
import { signPdf } from '../server/signing/sign-pdf';
import { renderReportPdf } from '../templates/report/render-report';
import type { ReportDocument } from '../templates/report/report-document';
import { buildSampleReportDocument } from '../templates/report/sample-report-document';
import { buildSampleResults } from '../templates/report/sample-report-results';

const TARGET_WARM_MS = 600;
const TARGET_FRESH_MS = 1500;
const PLOTS = 10;
const POINTS_PER_PLOT = 1000;

/**
 * About 20 A4 pages at scale 10 (the targets' size): front matter, a long results table, a long
 * equipment list, 10 figures. Scale 1 and 100 give a tenth and ten times the results and figures.
 */
function benchReport(scale = 10): ReportDocument {
  const options = { count: Math.round(21.5 * scale), plotCount: Math.max(1, Math.round(scale)), pointsPerPlot: POINTS_PER_PLOT };
  // Only the mask figures count: drop the sample's IMD figure.
  const results = buildSampleResults(options).map((r) =>
    r.testName === 'Two-tone intermodulation' ? { ...r, plot: undefined } : r,
  );
  const base = buildSampleReportDocument();
  const equipment = Array.from({ length: 40 }, (_, i) => ({
    ...base.equipment[i % base.equipment.length],
    serialNumber: `EQ-${1000 + i}`,
  }));
  return buildSampleReportDocument({ results, equipment });
}

async function generateAndSign(report: ReportDocument, identity: LabSigningIdentity) {
  const t0 = performance.now();
  const { pdf, pageCount } = await renderReportPdf(report);
  const t1 = performance.now();
  const signed = await signPdf(pdf, identity, { reason: 'bench', name: report.authorizedBy.name });
  const sha256 = sha256Hex(signed);
  const t2 = performance.now();
  const bytes = signed.length;
  return { renderMs: t1 - t0, signMs: t2 - t1, totalMs: t2 - t0, pageCount, bytes, sha256 };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const ms = (x: number) => `${x.toFixed(0)} ms`;

async function freshChild(): Promise<void> {
  const identity = JSON.parse(process.env.SIDECHECK_BENCH_IDENTITY ?? '{}') as LabSigningIdentity;
  const startedMs = performance.now(); // since process start: includes node boot and module loading
  const run = await generateAndSign(benchReport(), identity);
  const sinceProcessStartMs = performance.now();
  const line = JSON.stringify({ sinceProcessStartMs, moduleLoadMs: startedMs, ...run });
  process.stdout.write(`${line}\n`);
}

async function main(): Promise<void> {
  const quick = process.argv.includes('--quick');
  const identity = generateLabSigningIdentity({ labName: 'Kestrelmoor RF Lab', country: 'GB' });
  const report = benchReport();
  const warmups = quick ? 2 : 4;
  const runs = quick ? 3 : 9;
  for (let i = 0; i < warmups; i++) await generateAndSign(report, identity);
  const warm = [];
  for (let i = 0; i < runs; i++) warm.push(await generateAndSign(report, identity));

  const freshRuns: Record<string, number>[] = [];
  for (let i = 0; i < (quick ? 1 : 3); i++) {
    const started = performance.now();
    const child = spawnSync(process.execPath, [...process.execArgv, __filename, '--fresh-child'], {
      env: { ...process.env, SIDECHECK_BENCH_IDENTITY: JSON.stringify(identity) },
      encoding: 'utf8',
    });
    if (child.status !== 0) throw new Error(`fresh child failed: ${child.stderr}`);
    const lastLine = child.stdout.trim().split('\n').pop() ?? '{}';
    const report = JSON.parse(lastLine) as Record<string, number>;
    freshRuns.push({ wallMs: performance.now() - started, ...report });
  }

  const warmTotal = median(warm.map((r) => r.totalMs));
  const fresh = median(freshRuns.map((r) => r.sinceProcessStartMs));
  const freshFirstRun = median(freshRuns.map((r) => r.totalMs));
  const freshModules = median(freshRuns.map((r) => r.moduleLoadMs));
  const pages = warm[0].pageCount;
  const kB = (warm[0].bytes / 1024).toFixed(0);
  const renderMs = median(warm.map((r) => r.renderMs));
  const signMs = median(warm.map((r) => r.signMs));
  const wallMs = median(freshRuns.map((r) => r.wallMs));
  const lines = [
    `report-pdf: ${pages} pages, ${PLOTS} figures x ${POINTS_PER_PLOT} points, ${kB} kB signed`,
    `  warm, generation + signature (median of ${runs}): ${ms(warmTotal)}` +
      `   target <= ${TARGET_WARM_MS} ms`,
    `    of which generation ${ms(renderMs)}, signature + hash ${ms(signMs)}`,
    `  fresh process, start to signed PDF (median of ${freshRuns.length}): ${ms(fresh)}` +
      `   target <= ${TARGET_FRESH_MS} ms`,
    `    of which node start + module loading (tsx) ${ms(freshModules)},` +
      ` first generation + signature ${ms(freshFirstRun)}; wall incl. spawn ${ms(wallMs)}`,
  ];
  for (const line of lines) console.log(line);

  // How it grows: 1x = 22 results and 1 figure; 10x is the target report above; 100x ten times that.
  const growth: { scale: string; pages: number; ms: number }[] = [];
  for (const scale of quick ? [1, 10] : [1, 10, 100]) {
    const doc = benchReport(scale);
    const times = [];
    let pageCount = 0;
    for (let i = 0; i < (scale >= 100 ? 1 : 3); i++) {
      const r = await generateAndSign(doc, identity);
      times.push(r.totalMs);
      pageCount = r.pageCount;
    }
    growth.push({ scale: `${scale}x`, pages: pageCount, ms: Math.round(median(times)) });
  }
  console.log('  growth (generation + signature, warm): ' + growth.map((g) => `${g.scale} ${g.pages} pages ${g.ms} ms`).join(' · '));
  console.log(
    JSON.stringify({
      bench: 'report-pdf',
      pages,
      plots: PLOTS,
      pointsPerPlot: POINTS_PER_PLOT,
      warmMedianMs: Math.round(warmTotal),
      warmRenderMs: Math.round(renderMs),
      warmSignMs: Math.round(signMs),
      freshProcessMs: Math.round(fresh),
      freshModuleLoadMs: Math.round(freshModules),
      freshFirstRunMs: Math.round(freshFirstRun),
      targets: { warmMs: TARGET_WARM_MS, freshMs: TARGET_FRESH_MS },
      withinTargets: { warm: warmTotal <= TARGET_WARM_MS, fresh: fresh <= TARGET_FRESH_MS },
      growth,
    }),
  );
}

(process.argv.includes('--fresh-child') ? freshChild() : main()).catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
