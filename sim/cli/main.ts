/**
 * The `freezeline` command. Exit codes: 0 success, 2 invalid input (each message names the field and the value),
 * 1 internal failure, 3 the run finished but a stated expectation (the scenario's `expect` block) or a `run --require` condition failed,
 * 4 the run stopped before its end for a physical reason or at the run-time ceiling (the message says which). `run --json` writes
 * exactly the result document on stdout and nothing else; for a run that stopped, `{ "stopped": { reason, t_s, message }, "series" }`,
 * the series recorded up to the stop (and `--csv` writes that series).
 */
import { coefficientTable } from './coefficient-table.ts';
import { writeFileSync } from 'node:fs';
import { Command, CommanderError } from 'commander';
import { libraryFile, libraryNames } from '../scenario/library.ts';
import { assertFinite, resultDocument, seriesDocument } from '../observe/result.ts';
import { benchProblem } from './bench-run.ts';
import { CheckFailed, EXIT, InputError, readProblem, readScenario, RunStopped, runOrFail } from './input.ts';
import { countExpectations, evaluateExpectations, unmet } from '../scenario/expect.ts';
import { htmlReport } from './report-html.ts';
import { collectRequirement, parseRequirements, reportRequirements } from './require-check.ts';
import { registerSweep } from './cmd-sweep.ts';
import { registerSeek } from './cmd-seek.ts';
import { registerAmbient } from './cmd-ambient.ts';
import { registerWindow } from './cmd-window.ts';
import { registerSalt } from './cmd-salt.ts';
import { outputTimesCsv, seriesCsv } from '../observe/series-csv.ts';
import type { RunRecord } from '../observe/record.ts';
import { summaryTable } from './table.ts';

function program(): Command {
  const cli = new Command('freezeline')
    .description('Transient thermal simulator for a heated molten-salt cell: when does the separator freeze, and how close does each layer come to its limit?')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) })
    .addHelpText('after', `
Exit codes: ${EXIT.ok} done; ${EXIT.invalid} invalid input (the message names the field and the value); ${EXIT.failedCheck} a stated
expectation or a --require condition not met; ${EXIT.stopped} the run stopped before its end, for a physical reason
(heat drawn beyond what the stack holds) or at the run-time ceiling; ${EXIT.internal} an internal failure.`);

  cli.command('run').argument('<file>', 'scenario file (JSON)')
    .description('simulate a scenario and print the verdicts')
    .option('--json', 'write the result document (JSON) on stdout, nothing else')
    .option('--csv <out>', 'also write the time series to a CSV file')
    .option('--csv-at <rows>', 'CSV rows: "series" (every recorded point) or "output" (the scenario\'s output times, with probes)', 'series')
    .option('--report <out>', 'also write a one-page, self-contained HTML report')
    .option('--verbose', 'also print the solver\'s convection details (Rayleigh numbers)')
    .option('--coefficients', 'also print every coefficient the solver used, with its source (a formula, a library file, or the scenario file)')
    .option('--require <EXPR>', 'a condition on the verdicts, e.g. "safe_window_s>=60" or "margin_K>=25" (repeatable); exit 3 if one is not met', collectRequirement, [])
    .action((file: string, opts: { json?: boolean; csv?: string; csvAt: string; report?: string; verbose?: boolean; coefficients?: boolean; require: string[] }) => {
      if (opts.csvAt !== 'series' && opts.csvAt !== 'output') throw new InputError(`--csv-at: must be "series" or "output", got ${JSON.stringify(opts.csvAt)}`);
      const { scenario, problem } = readScenario(file);
      const requirements = parseRequirements(opts.require, problem);
      // the CSV of a record: every recorded point, or the output times it reached
      const writeCsv = (csvFile: string, record: RunRecord) => {
        const reached = record.tS[record.tS.length - 1] ?? 0;
        writeFileSync(csvFile, opts.csvAt === 'output'
          ? outputTimesCsv(record, problem.outputTimesS.filter((t) => t <= reached), { labels: problem.probeLabels, probes: record.probes })
          : seriesCsv(record));
      };
      let out;
      try {
        out = runOrFail(problem, file);
      } catch (e) {
        if (e instanceof RunStopped && e.record) {
          // what the run recorded before it stopped is still worth a look: the CSV up to there, and with --json a
          // document either way, why and when the run stopped with its series so far
          const record = e.record;
          if (opts.csv) {
            writeCsv(opts.csv, record);
            e.message += `\n${file}: the series up to t = ${Number((record.tS[record.tS.length - 1] ?? 0).toPrecision(6))} s is in ${opts.csv}`;
          }
          if (opts.json) {
            const doc = { stopped: { reason: e.reason, t_s: e.tS, message: e.detail }, series: seriesDocument(problem, record) };
            assertFinite(doc, 'stopped run'); // as the result document: a NaN here is a defect, not a value to print
            process.stdout.write(`${JSON.stringify(doc)}\n`);
          }
        }
        throw e;
      }
      // the accuracy plan as run (an accuracy asked may be met by a rung below the plan: run.ts runProblem)
      const solvedAs = { ...problem, numerics: out.problem.numerics };
      const expectations = evaluateExpectations(scenario.expect, out.summary);
      if (opts.csv) writeCsv(opts.csv, out.record);
      if (opts.report) writeFileSync(opts.report, htmlReport({ file, description: scenario.description, problem, summary: out.summary, record: out.record, expectations }));
      // requirement lines go beside the expectations, before the hazard list that closes the table (stderr with --json)
      const requirementLines: string[] = [];
      const unmetRequirements = reportRequirements(requirements, out.summary, file, (s) => requirementLines.push(s.replace(/\n$/, '')));
      if (opts.json) {
        process.stdout.write(`${JSON.stringify(resultDocument(solvedAs, out.grid, out.record, out.summary, out.stats))}\n`);
        for (const line of requirementLines) process.stderr.write(`${line}\n`);
      } else {
        process.stdout.write(`${summaryTable(solvedAs, out.summary, out.record, { expectations, requirements: requirementLines, verbose: opts.verbose, steps: out.stats.steps })}\n`);
        if (opts.coefficients) process.stdout.write(`\n${coefficientTable(problem)}\n`);
      }
      // every unmet expectation and requirement on stderr, then exit 3
      const failed = [...unmet(expectations).map((o) => `${file}: expectation not met: ${o.statement}; the run gave ${o.actual}`), ...unmetRequirements];
      if (failed.length > 0) throw new CheckFailed(failed.join('\n'));
    });

  cli.command('check').argument('<file>', 'scenario file (JSON)')
    .description('validate a scenario without running it')
    .action((file: string) => {
      const { scenario, problem } = readScenario(file);
      const stated = countExpectations(scenario.expect);
      const note = stated > 0 ? `; ${stated} stated expectation${stated === 1 ? '' : 's'} not evaluated (check does not run the solver: use run)` : '';
      process.stdout.write(`${file}: valid (${problem.layers.length} layers, ${problem.durationS} s)${note}\n`);
    });

  cli.command('materials')
    .description('list the bundled materials with their limits and sources')
    .option('--json', 'as JSON')
    .action((opts: { json?: boolean }) => {
      const files = libraryNames().map((n) => libraryFile(n)!);
      if (opts.json) { process.stdout.write(`${JSON.stringify(files, null, 2)}\n`); return; }
      for (const f of files) {
        const range = f.melt && f.melt.solidus_C === f.melt.liquidus_C ? `at ${f.melt.solidus_C}` : `${f.melt?.solidus_C}–${f.melt?.liquidus_C}`;
        const melt = f.melt ? `melts ${range} °C, ${f.melt.latent_J_kg / 1000} kJ/kg` : 'no melt in range';
        const limits = (f.limits ?? []).map((l) => `${l.kind} ${l.at_C} °C`).join(', ') || 'none';
        process.stdout.write(`${f.name} — ${f.title ?? ''}\n  ${melt}; limits: ${limits}\n`);
        for (const [key, src] of Object.entries(f.sources)) process.stdout.write(`  ${key}: ${src}\n`);
      }
    });

  cli.command('bench').argument('<file>', 'scenario file (JSON)')
    .description('solve a scenario repeatedly in-process and report the speed')
    .option('--json', 'as JSON')
    .option('--runs <n>', 'number of timed runs', '20')
    .action((file: string, opts: { json?: boolean; runs: string }) => {
      const runs = Number(opts.runs);
      if (!Number.isInteger(runs) || runs < 1) throw new InputError(`--runs: must be a whole number ≥ 1, got ${JSON.stringify(opts.runs)}`);
      const figures = benchProblem(readProblem(file), runs);
      if (opts.json) process.stdout.write(`${JSON.stringify(figures)}\n`);
      else process.stdout.write(`median ${figures.median_ms.toFixed(2)} ms over ${figures.runs} runs; ${figures.cells} cells, ${figures.steps} steps, ${figures.newton_iterations} Newton iterations, ${(figures.cell_updates_per_s / 1e6).toFixed(1)} M cell-updates/s\n`);
    });
  // each study command registers itself from its own file (sim/cli/cmd-*.ts)
  registerSweep(cli);
  registerSeek(cli);
  registerAmbient(cli);
  registerWindow(cli);
  registerSalt(cli);
  return cli;
}

export function main(argv: readonly string[]): number {
  try {
    program().parse(argv as string[], { from: 'user' });
    return EXIT.ok;
  } catch (e) {
    if (e instanceof CommanderError) return e.exitCode === 0 ? EXIT.ok : EXIT.invalid;
    if (e instanceof InputError) { process.stderr.write(`${e.message}\n`); return EXIT.invalid; }
    if (e instanceof CheckFailed) { process.stderr.write(`${e.message}\n`); return EXIT.failedCheck; }
    if (e instanceof RunStopped) { process.stderr.write(`${e.message}\n`); return EXIT.stopped; }
    process.stderr.write(`freezeline: internal error: ${(e as Error).message}\n`);
    return EXIT.internal;
  }
}

// a reader that stops early (`| head`) is not an error of ours
process.stdout.on('error', (e: NodeJS.ErrnoException) => { if (e.code !== 'EPIPE') throw e; });
process.exitCode = main(process.argv.slice(2));
