/**
 * The command line: `quadspread demo`, `quadspread run <job.json>`,
 * `quadspread batch <kind> <file.csv>`, `quadspread schema <job|report>`.
 *
 * @module cli
 */
import { closeSync, openSync, readSync } from 'node:fs';
import { Argument, Command, CommanderError, InvalidArgumentError, Option } from 'commander';
import { sameFile, writeFilesAtomic } from './atomic.js';
import { BATCH_KINDS, runBatch } from './batch.js';
import type { BatchOptions } from './batch.js';
import { DEMO_JOB } from './demo-job.js';
import { EXIT, JobInvalid, JobUnsolvable } from './failure.js';
import { parseJob, runJob } from './job.js';
import type { ArithmeticName } from './job.js';
import { visibleControls } from './escape.js';
import { renderJson } from './render-json.js';
import { renderMarkdown } from './render-markdown.js';
import { renderText } from './render-text.js';
import { renderHtml } from './render-html.js';
import { parseDisplayOption } from './display.js';
import { REPORT_SCHEMA } from './report-schema.js';
import { jobSchema } from './schema.js';
import { renderSketch } from './sketch.js';
import { exportText, loadPoints, type GridOptions } from './interop.js';
import { TASK_KINDS } from './tasks/index.js';
import { version } from '../../package.json';

/** Where the program writes, so tests and embedders can capture it. */
export interface Io {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Whether stderr is a terminal (the batch progress indicator shows only then). */
  stderrIsTTY: boolean;
  /** The standard input as text, for `run -` (default: the process's standard input). */
  stdin?: () => Promise<string>;
  /**
   * Writes bytes (UTF-8) to the standard output, where the batch command has them already;
   * returns `true` only if done with them (written or copied), so that their memory may be
   * filled again.
   */
  stdoutBytes?: (bytes: Uint8Array) => boolean | void;
  /** The script that runs batch workers (the command's own file); without it a batch runs on one thread. */
  workerScript?: URL;
}

/**
 * The version printed by `--version` and in report headers: package.json's, read when the CLI
 * is bundled (esbuild keeps only this field of the JSON).
 */
export const VERSION: string = version;

interface ReportOptions {
  arithmetic: ArithmeticName;
  digits: number;
  format: 'text' | 'markdown' | 'json' | 'html';
  sketch?: string;
  out?: string;
  display?: string;
  detail?: boolean;
  failOnCheck?: boolean;
  date?: string;
  computedBy?: string;
  checkedBy?: string;
  /** `--export <format> <file>`. */
  export?: string[];
  csvMode?: 'exchange' | 'spreadsheet';
  grid?: string;
  toWgs84?: string;
  plane?: boolean;
}

function dateOption(value: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  const d = m ? new Date(`${value}T00:00:00Z`) : undefined;
  if (!d || Number.isNaN(d.getTime()) || d.toISOString().slice(0, 10) !== value)
    throw new InvalidArgumentError(`${JSON.stringify(value)} is not a date YYYY-MM-DD`);
  return value;
}

function digitsOption(value: string): number {
  const n = Number(value);
  if (!/^\d+$/.test(value) || n < 1 || n > 100)
    throw new InvalidArgumentError(`${JSON.stringify(value)} is not a whole number from 1 to 100`);
  return n;
}

function secondsOption(value: string): number {
  if (!/^[0-6]$/.test(value))
    throw new InvalidArgumentError(`${JSON.stringify(value)} is not a whole number from 0 to 6`);
  return Number(value);
}

function workersOption(value: string): number {
  const n = Number(value);
  if (!/^\d+$/.test(value) || n < 1 || n > 256)
    throw new InvalidArgumentError(`${JSON.stringify(value)} is not a whole number from 1 to 256`);
  return n;
}

function addReportOptions(cmd: Command): Command {
  return cmd
    .addOption(
      new Option(
        '-a, --arithmetic <kind>',
        'the arithmetic: exact fractions, big decimals or JS floats',
      )
        .choices(['rational', 'decimal', 'float'])
        .default('rational'),
    )
    .addOption(
      new Option('-d, --digits <n>', 'significant digits shown (decimal works with n + 10)')
        .argParser(digitsOption)
        .default(10),
    )
    .addOption(
      new Option('-f, --format <format>', 'report format')
        .choices(['text', 'markdown', 'json', 'html'])
        .default('text'),
    )
    .option(
      '--display <rules>',
      'how numbers are written, e.g. lengths=4,seconds=0,bearings=quadrant (see docs/cli.md)',
    )
    .option('--detail', 'text and Markdown also show machine keys, exact forms and quadrances')
    .option(
      '--fail-on-check',
      `exit ${EXIT.CHECK_FAILED} when a check fails (the report is still written)`,
    )
    .addOption(
      new Option('--date <yyyy-mm-dd>', 'the date in the header (default: today)').argParser(
        dateOption,
      ),
    )
    .option('--computed-by <name>', 'who computed, for the header')
    .option('--checked-by <name>', 'who checked, for the header')
    .option('-s, --sketch <file.svg>', 'also write an SVG sketch of the configuration to this file')
    .option('-o, --out <file>', 'write the report to this file instead of the standard output')
    .option(
      '--export <format-and-file...>',
      'also write the points, traverses, alignments and parcels as geojson, landxml or csv to a file: --export geojson site.geojson (see docs/interop.md)',
    )
    .option('--grid <EPSG code>', 'the grid of the coordinates, for GeoJSON (e.g. EPSG:27700)')
    .option(
      '--to-wgs84 <file.json|coincident>',
      "the grid's datum to WGS 84: a JSON file { method, parameters }, or coincident",
    )
    .option('--plane', 'GeoJSON of plane coordinates (marked as not RFC 7946) instead of WGS 84')
    .addOption(
      new Option('--csv-mode <mode>', 'CSV export: neutralise formulas, or keep names exactly')
        .choices(['spreadsheet', 'exchange'])
        .default('spreadsheet'),
    );
}

/** Reads `--export <format> <file>`. */
function exportOption(o: ReportOptions): { format: string; file: string } | undefined {
  if (o.export === undefined) return undefined;
  const [format, file, ...rest] = o.export;
  if (file === undefined || rest.length > 0)
    throw new JobInvalid(
      '--export',
      `give a format and a file, after the job file: --export geojson site.geojson (got ${o.export.map((a) => JSON.stringify(a)).join(' ')})`,
    );
  if (format !== 'geojson' && format !== 'landxml' && format !== 'csv')
    throw new JobInvalid('--export', `${JSON.stringify(format)} is not geojson, landxml or csv`);
  return { format, file };
}

function report(job: unknown, source: string, o: ReportOptions, io: Io, jobFile?: string): number {
  const exp = exportOption(o);
  for (const other of [o.out, o.sketch])
    if (exp !== undefined && other !== undefined && sameFile(exp.file, other))
      throw new JobInvalid('--export', `${JSON.stringify(exp.file)} is also another output file`);
  if (o.out !== undefined && o.sketch !== undefined && sameFile(o.out, o.sketch)) {
    throw new JobInvalid(
      '--sketch',
      `${JSON.stringify(o.sketch)} is also the --out file: give them different names`,
    );
  }
  // Writing the report over the job file would lose the readings.
  for (const [option, target] of [
    ['--out', o.out],
    ['--sketch', o.sketch],
    ['--export', exp?.file],
  ] as const) {
    if (jobFile !== undefined && target !== undefined && sameFile(target, jobFile)) {
      throw new JobInvalid(
        option,
        `${JSON.stringify(target)} is the job file itself: give the output another name`,
      );
    }
  }
  const r = runJob(job, TASK_KINDS, {
    arithmetic: o.arithmetic,
    digits: o.digits,
    source,
    version: VERSION,
    ...(o.display !== undefined ? { display: parseDisplayOption(o.display) } : {}),
    header: {
      ...(o.date !== undefined ? { date: o.date } : {}),
      ...(o.computedBy !== undefined ? { computedBy: o.computedBy } : {}),
      ...(o.checkedBy !== undefined ? { checkedBy: o.checkedBy } : {}),
    },
  });
  const detail = { detail: o.detail === true };
  const text =
    o.format === 'json'
      ? renderJson(r)
      : o.format === 'markdown'
        ? renderMarkdown(r, detail)
        : o.format === 'html'
          ? renderHtml(r)
          : renderText(r, detail);
  const files: { target: string; text: string }[] = [];
  if (o.out !== undefined) files.push({ target: o.out, text });
  if (o.sketch !== undefined) files.push({ target: o.sketch, text: renderSketch(r) });
  if (exp !== undefined)
    files.push({
      target: exp.file,
      text: exportText(exp.format, r, job, o as GridOptions & ReportOptions, (f) =>
        readText(f, '--to-wgs84 file'),
      ),
    });
  writeFilesAtomic(files);
  if (o.out === undefined) io.stdout(text);
  else io.stderr(`report written to ${o.out}\n`);
  if (o.sketch !== undefined) io.stderr(`sketch written to ${o.sketch}\n`);
  if (exp !== undefined) io.stderr(`${exp.format} written to ${exp.file}\n`);
  if (o.failOnCheck && r.summary.failed > 0) {
    io.stderr(
      `quadspread: ${r.summary.failed} of ${r.summary.checks} check${r.summary.checks === 1 ? '' : 's'} failed (--fail-on-check)\n`,
    );
    return EXIT.CHECK_FAILED;
  }
  return EXIT.OK;
}

/** Largest job file read, in bytes (a job is a page of readings, not a data set: use batch for those). */
export const MAX_JOB_BYTES = 50 * 1024 * 1024;

function readText(file: string, what: string): string {
  const tooLarge = (): JobInvalid =>
    new JobInvalid(
      '',
      `the ${what} ${JSON.stringify(file)} is larger than ${MAX_JOB_BYTES / 1024 / 1024} MB (use quadspread batch for many cases)`,
    );
  let fd: number | undefined;
  try {
    // The limit is enforced while reading, not from the size the file claims: a device
    // (/dev/zero), a FIFO or process substitution has no size until it is read.
    fd = openSync(file, 'r');
    const chunks: Buffer[] = [];
    let total = 0;
    for (;;) {
      const chunk = Buffer.allocUnsafe(1 << 16);
      const n = readSync(fd, chunk, 0, chunk.length, null);
      if (n === 0) break;
      total += n;
      if (total > MAX_JOB_BYTES) throw tooLarge();
      chunks.push(n === chunk.length ? chunk : chunk.subarray(0, n));
    }
    return Buffer.concat(chunks, total)
      .toString('utf8')
      .replace(/^\uFEFF/, '');
  } catch (e) {
    if (e instanceof JobInvalid) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    throw new JobInvalid(
      '',
      `cannot read the ${what} ${JSON.stringify(file)}: ${code === 'EISDIR' ? 'it is a folder' : (code ?? (e as Error).message)}`,
    );
  } finally {
    if (fd !== undefined) closeSync(fd);
  }
}

/** Reads the whole standard input (or the embedder's `io.stdin`), refusing more than MAX_JOB_BYTES. */
async function readStdin(io: Io): Promise<string> {
  if (io.stdin !== undefined) return io.stdin();
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of process.stdin as AsyncIterable<Buffer>) {
    size += chunk.length;
    if (size > MAX_JOB_BYTES)
      throw new JobInvalid(
        '',
        `the job on the standard input is larger than ${MAX_JOB_BYTES / 1024 / 1024} MB`,
      );
    chunks.push(chunk);
  }
  return Buffer.concat(chunks)
    .toString('utf8')
    .replace(/^\uFEFF/, '');
}

/** Builds the commander program; `outcome.exitCode` is set by a command that ends otherwise than 0 without throwing. */
export function program(io: Io, outcome: { exitCode: number } = { exitCode: EXIT.OK }): Command {
  const p = new Command('quadspread');
  p.description(
    'Runs survey computation jobs in rational trigonometry (quadrance and spread) and reports results, uncertainties and checks.',
  )
    .version(VERSION)
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr })
    .exitOverride()
    .showHelpAfterError('(add --help for usage)');

  addReportOptions(
    p
      .command('demo')
      .description('run the bundled demonstration job (invented places) and print its report')
      .option('--job', 'print the demonstration job file instead of running it'),
  ).action((o: ReportOptions & { job?: boolean }) => {
    if (o.job) {
      io.stdout(JSON.stringify(DEMO_JOB, null, 2) + '\n');
      return;
    }
    outcome.exitCode = report(DEMO_JOB, 'demo', o, io);
  });

  addReportOptions(
    p
      .command('run')
      .description('run a job file (JSON; see docs/job-schema.json) and print its report')
      .argument('<job.json>', 'the job file; - reads the job from the standard input')
      .option(
        '--points <file>',
        "add the points of a CSV, GeoJSON or LandXML file to the job's points (see docs/interop.md)",
      ),
  ).action(async (file: string, o: ReportOptions & { points?: string }) => {
    const withPoints = (job: unknown): unknown =>
      o.points === undefined
        ? job
        : loadPoints(job, o.points, readText(o.points, 'points file'), o, (f) =>
            readText(f, '--to-wgs84 file'),
          );
    if (file === '-') {
      outcome.exitCode = report(withPoints(parseJob(await readStdin(io))), 'standard input', o, io);
      return;
    }
    outcome.exitCode = report(withPoints(parseJob(readText(file, 'job file'))), file, o, io, file);
  });

  p.command('batch')
    .description('stream a CSV of many cases through one computation, writing a CSV of results')
    .argument('<kind>', `what each row is: ${Object.keys(BATCH_KINDS).join(', ')}`)
    .argument('<file.csv>', 'the input CSV (first line: column names); - for the standard input')
    .addOption(
      new Option('-a, --arithmetic <kind>', 'the arithmetic')
        .choices(['rational', 'decimal', 'float'])
        .default('float'),
    )
    .addOption(
      new Option('-d, --digits <n>', 'significant digits written')
        .argParser(digitsOption)
        .default(10),
    )
    .option(
      '-o, --out <file>',
      'write the results to this file (atomically) instead of the standard output',
    )
    .option(
      '--exact',
      'also write exact columns (fractions, named <result>_exact), with --arithmetic rational',
    )
    .addOption(
      new Option('--angles <form>', 'angles written as decimal degrees or DMS text')
        .choices(['degrees', 'dms'])
        .default('degrees'),
    )
    .addOption(
      new Option('--seconds <n>', 'decimals of the seconds in DMS angles (0 to 6)')
        .argParser(secondsOption)
        .default(1),
    )
    .addOption(
      new Option(
        '--bad-rows <what>',
        'at a row that cannot be computed: stop (exit 2 or 3), or note why in an error column and go on',
      )
        .choices(['stop', 'note'])
        .default('stop'),
    )
    .addOption(
      new Option(
        '--workers <n>',
        'worker threads computing an input past its first MiB while this one reads and writes (default: one per idle core, the cores less the load average; 1: no worker threads, this one computes every row)',
      ).argParser(workersOption),
    )
    .action(async (kind: string, file: string, o: BatchOptions) => {
      await runBatch(kind, file, o, io);
    });

  p.command('schema')
    .description('print the JSON Schema of job files or of JSON reports')
    .addArgument(new Argument('<which>', 'job or report').choices(['job', 'report']))
    .action((which: string) => {
      io.stdout(
        JSON.stringify(which === 'job' ? jobSchema(TASK_KINDS) : REPORT_SCHEMA, null, 2) + '\n',
      );
    });
  return p;
}

/** Runs the command line with `argv` (without `node` and the script), returning the exit code. */
export async function main(argv: string[], io: Io): Promise<number> {
  const outcome = { exitCode: EXIT.OK as number };
  const p = program(io, outcome);
  try {
    await p.parseAsync(argv, { from: 'user' });
    return outcome.exitCode;
  } catch (e) {
    if (e instanceof CommanderError) {
      // --help and --version end with exit code 0; usage errors are bad input (2).
      return e.exitCode === 0 ? EXIT.OK : EXIT.INVALID;
    }
    if (e instanceof JobInvalid || e instanceof JobUnsolvable) {
      // Names and values from the job are shown with their control characters escaped.
      io.stderr(`quadspread: ${e.message.split('\n').map(visibleControls).join('\n')}\n`);
      return e.exitCode;
    }
    io.stderr(
      `quadspread: internal error (please report it): ${(e as Error).stack ?? String(e)}\n`,
    );
    return EXIT.INTERNAL;
  }
}
