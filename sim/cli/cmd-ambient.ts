/**
 * `freezeline ambient FILE [--from -54 --to 74 --count 15] [--margin-K 25] [--min-window-s 0] [--json]`: the usable
 * window and the binding margin against the ambient temperature, and the stretches of ambient where both pass
 * (sim/study/ambient.ts). The runs go through the sweep's worker pool.
 */
import type { Command } from 'commander';
import { formatMargin, formatNumber, formatTime } from '../observe/format.ts';
import { ambientDefaults, ambientPlan, ambientStudy, type AmbientOptions } from '../study/ambient.ts';
import type { SweepRow } from '../study/sweep.ts';
import { noValueWords, predictionNotCertification, verdictTerms, windowStatusWords } from '../observe/wording.ts';
import type { WindowStatus } from '../observe/verdict.ts';
import { runPoints } from './sweep-pool.ts';
import { finishAsync, orRefuse, parseJobs, parseNumberOption, readScenario } from './study-input.ts';

interface AmbientCliOptions { from?: string; to?: string; count?: string; marginK?: string; minWindowS?: string; jobs?: string; json?: boolean; progress: boolean }

const d = ambientDefaults;

export function registerAmbient(cli: Command): void {
  cli.command('ambient').argument('<file>', 'scenario file (JSON)')
    .description('the usable window and the binding margin over a range of ambient temperatures, and where both pass')
    .option('--from <C>', `lowest ambient, °C (default ${d.fromC}: the low end of the range commonly required of military thermal batteries, from memory)`)
    .option('--to <C>', `highest ambient, °C (default ${d.toC}: the high end of that range, from memory)`)
    .option('--count <n>', `ambient values, evenly spaced, ends included (default ${d.count})`)
    .option('--margin-K <K>', `least margin to every limit for a pass (default ${d.marginK} K; a few tens of kelvin is no margin: common practice, no source)`)
    .option('--min-window-s <s>', `least usable window for a pass (default ${d.minWindowS} s: any window)`)
    .option('--jobs <n>', 'worker threads (default: all cores)')
    .option('--json', 'as JSON: { points: [{ ambient_C, window_s, window_status, binding_layer, margin_K, pass, error }], passing, spacing_K, initial_follows }')
    .option('--no-progress', 'no progress bar')
    .addHelpText('after', '\ninitial_C follows the ambient when the file leaves it out or sets it equal to ambient_C; otherwise it is kept.')
    .action((file: string, opts: AmbientCliOptions) => {
      const { doc } = readScenario(file);
      const o: AmbientOptions = {
        fromC: parseNumberOption('--from', opts.from) ?? d.fromC,
        toC: parseNumberOption('--to', opts.to) ?? d.toC,
        count: parseNumberOption('--count', opts.count) ?? d.count,
        marginK: parseNumberOption('--margin-K', opts.marginK) ?? d.marginK,
        minWindowS: parseNumberOption('--min-window-s', opts.minWindowS) ?? d.minWindowS,
      };
      const plan = orRefuse(ambientPlan(doc, o));
      const jobs = parseJobs(opts.jobs);
      const rows: SweepRow[] = [];
      finishAsync(runPoints(plan, Array.from({ length: plan.count }, (_, i) => i), { jobs, progress: opts.progress, onRow: (r) => rows.push(r) }).then(() => {
        const study = ambientStudy(rows, o, plan.initialFollows);
        if (opts.json) { process.stdout.write(`${JSON.stringify(study)}\n`); return; }
        process.stdout.write(`${ambientText(study, o)}\n`);
      }));
    });
}

function ambientText(study: ReturnType<typeof ambientStudy>, o: AmbientOptions): string {
  const c = (v: number) => `${formatNumber(v, { decimals: 1 })} °C`;
  const lines = [
    `ambient study: ${study.points.length} runs from ${c(o.fromC)} to ${c(o.toC)}; pass = a ${verdictTerms.safe_window_s.term} ${o.minWindowS > 0 ? `of at least ${formatTime(o.minWindowS, '')}` : '(any length)'} and every margin at least ${o.marginK} K`,
    study.initial_follows ? '  the cell starts at the ambient (initial_C follows it)' : '  the cell starts at the initial_C of the file (it differs from its ambient_C, so it is kept)',
    '',
    `  ambient °C   ${verdictTerms.safe_window_s.term.padEnd(26)}  binding margin             pass`,
  ];
  // a run that did not finish is marked in the table and its reason given below it, so the columns stay aligned
  const unfinished: string[] = [];
  for (const p of study.points) {
    if (p.error !== null) unfinished.push(`    at ${c(p.ambient_C)}: ${p.error}`);
    const windowText = p.error !== null ? 'did not finish (below)' : p.window_s !== null ? formatTime(p.window_s, '') : windowStatusWords[p.window_status as WindowStatus]?.label ?? '';
    const margin = p.error !== null ? '' : p.binding_layer !== null ? `${p.binding_layer} ${formatMargin(p.margin_K, noValueWords.margin_K)}` : noValueWords.margin_K;
    lines.push(`  ${formatNumber(p.ambient_C, { decimals: 1 }).padStart(10)}   ${windowText.padEnd(26)}  ${margin.padEnd(25)}  ${p.pass ? 'yes' : 'NO'}`);
  }
  if (unfinished.length > 0) lines.push('', `  ${unfinished.length} of the ${study.points.length} runs did not finish:`, ...unfinished);
  lines.push('');
  if (study.passing.length === 0) lines.push('  both pass nowhere in this range');
  else {
    const parts = study.passing.map(([a, b]) => (a === b ? `at ${c(a)}` : `from ${c(a)} to ${c(b)}`));
    const all = study.passing.length === 1 && study.points.every((p) => p.pass);
    lines.push(all
      ? `  both pass at every ambient run, ${parts[0]}`
      : `  both pass ${parts.join(' and ')} (ambients run ${formatNumber(study.spacing_K, { decimals: 1 })} K apart: each edge lies within one spacing outside its stretch)`);
  }
  lines.push('', `  ${predictionNotCertification}`);
  return lines.join('\n');
}
