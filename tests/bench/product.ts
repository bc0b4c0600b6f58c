import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { craftNamed, createToken, revisionPath, signInWithFetch } from './api';
import { benchCompare } from './compare';
import { benchExchange } from './exchange';
import { createLargeCraft } from './large-craft';
import { benchHealthUnderHostileBodies } from './hostile';
import { benchReadsUnderLoad, benchServerEvaluation, type LoadFigures } from './server';
import { startBenchStack } from './stack';
import { benchKeystrokeToSummary, webDist, webJavaScriptGzipBytes } from './web';

/**
 * Benchmarks of the running product, after the engine's: the web bundle's size, keystroke to summary in
 * Chromium, the server's evaluation of a large revision, the comparison of two and the revision GET under load. They start their
 * own stack (tests/bench/stack.ts) and print one table, each figure beside its target. A figure that cannot
 * be measured (no web build, a request refused) is printed as such and the others still run.
 */

/** One line of the table: what was measured, the figure, and its target with whether it was met. */
interface Figure {
  name: string;
  measured: string;
  target?: { text: string; met: boolean };
}

/** The demo organisation admin: creates the benchmark crafts, and so is their chief engineer. */
const ADMIN = 'demo-ines';
/** A member of Tern who reads the whole sheet, as most readers of a revision do (the systems engineer). */
const READER = 'demo-amara';
const KEYSTROKE_ROWS = 1000;
const EVALUATION_ROWS = 5000;

const milliseconds = (value: number) => `${value.toFixed(1)} ms`;
const rate = (value: number) => `${value.toFixed(0)} req/s`;

/** The lines of one read under load: its rate beside the bare endpoint's, the ratio, p99 and failures, each against its goal. */
function loadFigures(what: string, { target, bare }: { target: LoadFigures; bare: LoadFigures }): Figure[] {
  const ratio = target.requestsPerSecond / bare.requestsPerSecond;
  return [
    {
      name: `${what}, 50 connections for 20 s: the read / bare Express + pg SELECT 1 beside it`,
      measured: `${rate(target.requestsPerSecond)} / ${rate(bare.requestsPerSecond)} = ${ratio.toFixed(2)}x`,
      target: { text: '>= 0.3x', met: ratio >= 0.3 },
    },
    {
      name: `${what}, p99 latency`,
      measured: milliseconds(target.p99Milliseconds),
      target: { text: '< 50 ms', met: target.p99Milliseconds < 50 },
    },
    { name: `${what}, errors, timeouts and non-2xx`, measured: String(target.failures), target: { text: '0', met: target.failures === 0 } },
  ];
}

/** TRIMSHEET_BENCH_ONLY=keystroke|evaluation|compare|load|hostile|exchange runs just that product benchmark (while working on it). */
const only = process.env.TRIMSHEET_BENCH_ONLY;

async function measure(figures: Figure[], name: string, work: () => Promise<Figure[]>): Promise<void> {
  if (only !== undefined && !name.toLowerCase().includes(only)) return;
  try {
    figures.push(...(await work()));
  } catch (error) {
    process.exitCode = 1;
    figures.push({
      name,
      measured: `failed: ${error instanceof Error ? (error.message.split('\n')[0] ?? '') : String(error)}`.slice(0, 300),
    });
  }
}

function bundleFigure(): Figure {
  const name = 'web JavaScript, gzip of dist/_expo/static/js/**/*.js';
  const bytes = webJavaScriptGzipBytes();
  if (bytes === undefined) return { name, measured: 'skipped: no web build in dist/ (npm start or npm test builds it)' };
  const limit = 1.5e6;
  return { name, measured: `${(bytes / 1e6).toFixed(2)} MB`, target: { text: '< 1.5 MB', met: bytes < limit } };
}

function printTable(figures: readonly Figure[], loadAverage: number): void {
  const nameWidth = Math.max(...figures.map((figure) => figure.name.length));
  const measuredWidth = Math.max(...figures.map((figure) => (figure.target ? figure.measured.length : 0)), 10);
  console.log(
    `\nthe product on this machine (medians unless said otherwise; load average ${loadAverage.toFixed(1)} on ${os.cpus().length} cores at the start)`,
  );
  for (const figure of figures) {
    const target = figure.target ? `  target ${figure.target.text}: ${figure.target.met ? 'met' : 'MISSED'}` : '';
    console.log(`${figure.name.padEnd(nameWidth)}  ${figure.target ? figure.measured.padStart(measuredWidth) : figure.measured}${target}`);
  }
}

/** Runs the product benchmarks and prints their table; sets a failing exit code when one could not be measured. */
export async function runProductBenchmarks(): Promise<void> {
  // Other work on the machine skews every figure: the table says how busy it was.
  const [loadAverage = 0] = os.loadavg();
  const figures: Figure[] = [bundleFigure()];
  const stack = await startBenchStack();
  try {
    const api = await signInWithFetch(stack.appUrl, ADMIN);
    const token = await createToken(api, 'read');
    const reader = await signInWithFetch(stack.appUrl, READER);

    const keystroke = `keystroke to updated summary, ${KEYSTROKE_ROWS.toLocaleString('en')}-row sheet (Chromium, 1280x800)`;
    await measure(figures, keystroke, async () => {
      if (!fs.existsSync(path.join(webDist, 'index.html'))) return [{ name: keystroke, measured: 'skipped: no web build in dist/' }];
      const craft = await createLargeCraft(api, stack.databaseUrl, KEYSTROKE_ROWS);
      const { median, mode } = await benchKeystrokeToSummary(stack.appUrl, ADMIN, craft.craftId);
      return [{ name: `${keystroke}, recomputed ${mode}`, measured: milliseconds(median), target: { text: '< 16 ms', met: median < 16 } }];
    });

    await measure(figures, `server evaluation of a ${EVALUATION_ROWS.toLocaleString('en')}-row revision`, async () => {
      const craft = await createLargeCraft(api, stack.databaseUrl, EVALUATION_ROWS);
      const median = await benchServerEvaluation(stack.appUrl, token, { ...craft, rows: EVALUATION_ROWS });
      return [
        {
          name: `server evaluation of a ${EVALUATION_ROWS.toLocaleString('en')}-row revision (GET .../evaluation)`,
          measured: milliseconds(median),
        },
      ];
    });

    // Named without "evaluation", so that TRIMSHEET_BENCH_ONLY=evaluation does not run it too.
    const comparison = `compare two ${EVALUATION_ROWS.toLocaleString('en')}-row revisions`;
    await measure(figures, comparison, async () => {
      const compared = await benchCompare(stack.appUrl, token, api, stack.databaseUrl, EVALUATION_ROWS);
      const changed = `GET .../compare, ${compared.changedRows} rows changed`;
      return [
        {
          name: `${comparison} including their evaluation (${changed})`,
          measured: milliseconds(compared.compare),
          target: { text: '< 50 ms', met: compared.compare < 50 },
        },
        { name: `${comparison} and what moved one output (${changed})`, measured: milliseconds(compared.whatMoved) },
        {
          name: `${comparison}, the first request of the craft (one sample, no analysis to reuse)`,
          measured: milliseconds(compared.first),
        },
      ];
    });

    // TRIMSHEET_BENCH_ONLY=exchange: the workbook export and import of a large revision, and a zip bomb refused.
    await measure(figures, `workbook exchange of a ${EVALUATION_ROWS.toLocaleString('en')}-row revision`, async () => {
      const craft = await createLargeCraft(api, stack.databaseUrl, EVALUATION_ROWS);
      const exchange = await benchExchange(
        stack.appUrl,
        await createToken(api, 'read_write'),
        { ...craft, rows: EVALUATION_ROWS },
        stack.serverPid,
      );
      const rows = `${EVALUATION_ROWS.toLocaleString('en')}-row revision`;
      const peak = exchange.bomb.peakRssDeltaBytes;
      return [
        {
          name: `export of a ${rows} as .xlsx (GET .../export.xlsx, ${(exchange.workbookBytes / 1024).toFixed(0)} KB)`,
          measured: milliseconds(exchange.exportMedian),
          target: { text: '< 600 ms', met: exchange.exportMedian < 600 },
        },
        {
          name: `import of that workbook, one value changed (POST .../imports: checks, parsing, preview stored)`,
          measured: milliseconds(exchange.importMedian),
          target: { text: '< 500 ms', met: exchange.importMedian < 500 },
        },
        {
          name: `server memory while refusing a ${(exchange.bomb.bytes / 1024).toFixed(0)} KB zip bomb of 400 MB (peak RSS over before; answer ${exchange.bomb.status})`,
          measured: peak === undefined ? 'not measured (no /proc)' : `${(peak / 1024 / 1024).toFixed(1)} MB`,
          ...(peak === undefined ? {} : { target: { text: '< 64 MB', met: peak < 64 * 1024 * 1024 && exchange.bomb.status === 413 } }),
        },
      ];
    });

    await measure(figures, 'signed-in reads under load, 50 connections', async () => {
      const tern = await craftNamed(reader, 'Tern');
      const browser = { cookie: reader.cookieHeader() };
      const revisionUrl = `${stack.appUrl}${revisionPath(tern.id, tern.draftRevisionId)}`;
      const reads = [
        { what: 'GET /api/crafts by a systems engineer, session cookie', url: `${stack.appUrl}/api/crafts`, headers: browser },
        { what: "GET of Tern's draft by its systems engineer, session cookie", url: revisionUrl, headers: browser },
        {
          what: "GET of Tern's draft by its systems engineer, bearer token",
          url: revisionUrl,
          headers: { authorization: `Bearer ${await createToken(reader, 'read')}` },
        },
      ];
      const measured = await benchReadsUnderLoad(stack, reads);
      return reads.flatMap((read, index) => {
        const figures = measured[index];
        return figures ? loadFigures(read.what, figures) : [];
      });
    });

    await measure(figures, 'hostile bodies: health check under load by anonymous 1 MB nested bodies', async () => {
      const { alone, underAttack, answers } = await benchHealthUnderHostileBodies(stack.appUrl);
      return [
        { name: 'GET /api/health, one at a time, alone', measured: milliseconds(alone) },
        {
          name: `GET /api/health while 4 anonymous connections post 1 MB nested JSON (${answers})`,
          measured: milliseconds(underAttack),
          target: { text: '< 3x alone', met: underAttack < 3 * alone },
        },
      ];
    });
  } finally {
    // The table comes last, after whatever the stopping server has to say.
    try {
      await stack.stop();
    } finally {
      printTable(figures, loadAverage);
    }
  }
}
