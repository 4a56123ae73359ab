/**
 * `freezeline sweep FILE --vary KEY=FROM:TO:COUNT … [--list KEY=a,b,c …] [--format csv|jsonl] [--shard K/N] [--jobs N]`:
 * a full grid over inputs of a scenario, one summary-only run per point, in parallel on worker threads, one row per
 * point on stdout in index order. Bad paths and ranges are refused before anything runs; a point that is invalid or
 * fails is a row with its error.
 */
import type { Command } from 'commander';
import { InputError } from './input.ts';
import { runPoints } from './sweep-pool.ts';
import { collect, finishAsync, orRefuse, parseJobs, readScenario } from './study-input.ts';
import { parseList, parseShard, parseVary, planSweep, shardIndices, type SweepRow } from '../study/sweep.ts';
import { csvHeader, csvRow, jsonlRow } from '../study/sweep-rows.ts';

interface SweepOptions { vary: string[]; list: string[]; format: string; shard?: string; jobs?: string; progress: boolean }

export function registerSweep(cli: Command): void {
  cli.command('sweep').argument('<file>', 'scenario file (JSON)')
    .description('run a scenario over a grid of inputs and print one row of verdicts per run')
    .option('--vary <KEY=FROM:TO:COUNT>', 'vary an input over COUNT evenly spaced values (repeatable; KEY is a path such as ambient_C, layers.separator.thickness_mm, bottom.1.from_s)', collect, [])
    .option('--list <KEY=a,b,c>', 'give an input a list of values (repeatable)', collect, [])
    .option('--format <csv|jsonl>', 'csv (one line per run) or jsonl ({ index, inputs, summary, error } per line)', 'csv')
    .option('--shard <K/N>', 'run only part K of N: the points whose index is K-1 modulo N (sort the joined parts by index)')
    .option('--jobs <n>', 'worker threads (default: all cores); 1 runs in this thread')
    .option('--no-progress', 'no progress bar (it is only drawn when stderr is a terminal anyway)')
    .addHelpText('after', '\nThe first --vary/--list varies slowest, the last fastest. A run that is invalid or fails is a row with its error.')
    .action((file: string, opts: SweepOptions) => {
      const { problem, doc } = readScenario(file);
      if (opts.format !== 'csv' && opts.format !== 'jsonl') throw new InputError(`--format: must be csv or jsonl, got ${JSON.stringify(opts.format)}`);
      const axes = [...opts.vary.map((v) => orRefuse(parseVary(doc, v))), ...opts.list.map((l) => orRefuse(parseList(doc, l)))];
      const plan = orRefuse(planSweep(doc, axes));
      const shard = opts.shard === undefined ? undefined : orRefuse(parseShard(opts.shard));
      const jobs = parseJobs(opts.jobs);
      const keys = axes.map((a) => a.key);
      const layerIds = problem.layers.map((l) => l.id);
      const write = (s: string) => { process.stdout.write(`${s}\n`); };
      if (opts.format === 'csv' && (shard === undefined || shard.k === 1)) write(csvHeader(keys, layerIds));
      let failed = 0;
      const onRow = (row: SweepRow) => {
        if (row.error !== null) failed++;
        write(opts.format === 'csv' ? csvRow(row, keys, layerIds) : jsonlRow(row));
      };
      const indices = shardIndices(plan.count, shard);
      finishAsync(runPoints(plan, indices, { jobs, progress: opts.progress, onRow }).then(() => {
        if (failed > 0) process.stderr.write(`${failed} of ${indices.length} runs have an error (see their rows)\n`);
      }));
    });
}
