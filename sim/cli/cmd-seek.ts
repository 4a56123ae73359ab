/**
 * `freezeline seek FILE --adjust KEY --min A --max B --target "safe_window_s>=600" [--largest] [--json]`: the smallest
 * (largest) value of one input that meets a target on the verdicts (sim/study/seek.ts: a coarse scan, then the bracket
 * narrowed by regula falsi, or by bisection).
 * `--json` prints { value, met, solves, summary, monotonic, met_intervals, bracket, best, adjust, target }.
 */
import type { Command } from 'commander';
import { InputError } from './input.ts';
import { orRefuse, parseNumberOption, readScenario } from './study-input.ts';
import { formatSignificant } from '../observe/format.ts';
import { parsePath, resolveLeaf } from '../study/scenario-path.ts';
import { scenarioProbe, seek, seekDefaults } from '../study/seek.ts';
import { predictionNotCertification } from '../observe/wording.ts';
import { checkTarget, parseTarget, readingText, targetValue } from '../study/target.ts';

interface SeekCliOptions { adjust: string; min: string; max: string; target: string; largest?: boolean; json?: boolean; scan?: string; tolerance?: string }

export function registerSeek(cli: Command): void {
  cli.command('seek').argument('<file>', 'scenario file (JSON)')
    .description('find the smallest (or largest) value of one input for which the run meets a target')
    .requiredOption('--adjust <KEY>', 'the input to adjust, a path such as layers.top-insulation.thickness_mm')
    .requiredOption('--min <A>', 'lower end of the range, in the unit of the key')
    .requiredOption('--max <B>', 'upper end of the range')
    .requiredOption('--target <EXPR>', 'a target on the verdicts, e.g. "safe_window_s>=600" or "layers.anode.margin_K>=25"')
    .option('--largest', 'the largest value that meets the target (default: the smallest)')
    .option('--scan <n>', `coarse scan points before narrowing (default ${seekDefaults.scanCount})`)
    .option('--tolerance <d>', `width of the final bracket, in the key's unit (default ${seekDefaults.relativeTolerance} of the range)`)
    .option('--json', 'as JSON: { value, met, solves, summary, … }')
    .addHelpText('after', '\nA verdict that does not exist (null, e.g. no safe window) fails the target. When the target is met on more\nthan one stretch of the range the response is not monotonic: every stretch the scan saw is listed.')
    .action((file: string, opts: SeekCliOptions) => {
      const { problem, doc } = readScenario(file);
      const path = orRefuse(parsePath(opts.adjust));
      const place = resolveLeaf(doc, path);
      if (!place.ok) throw new InputError(`--adjust ${place.message}`);
      const min = parseNumberOption('--min', opts.min)!;
      const max = parseNumberOption('--max', opts.max)!;
      if (!(min < max)) throw new InputError(`--min/--max: --min must be below --max, got ${opts.min} and ${opts.max}`);
      const target = orRefuse(parseTarget(opts.target));
      const bad = checkTarget(target, problem.layers.map((l) => l.id));
      if (bad) throw new InputError(`--target: ${bad}`);
      const scanCount = parseNumberOption('--scan', opts.scan);
      if (scanCount !== undefined && (!Number.isInteger(scanCount) || scanCount < 2)) throw new InputError(`--scan: must be a whole number ≥ 2, got ${opts.scan}`);
      const tolerance = parseNumberOption('--tolerance', opts.tolerance);
      if (tolerance !== undefined && !(tolerance > 0)) throw new InputError(`--tolerance: must be > 0, got ${opts.tolerance}`);
      const result = seek(scenarioProbe(doc, place.value, target), { min, max, largest: opts.largest ?? false, ...(scanCount !== undefined ? { scanCount } : {}), ...(tolerance !== undefined ? { tolerance } : {}) });
      if (opts.json) {
        process.stdout.write(`${JSON.stringify({ ...result, adjust: opts.adjust, target: target.text })}\n`);
        return;
      }
      const which = opts.largest ? 'largest' : 'smallest';
      const lines: string[] = [];
      if (result.met && result.value !== null) {
        const reading = result.summary ? readingText(targetValue(target, result.summary)) : '';
        const within = result.bracket > 0 ? ` (within ${formatSignificant(result.bracket)})` : ` (the ${opts.largest ? 'upper' : 'lower'} end of the range: it may hold beyond it too)`;
        lines.push(`${which} ${opts.adjust} meeting ${target.text}: ${formatSignificant(result.value)}${within}`);
        lines.push(`  there ${target.pathText} = ${reading}`);
      } else {
        const none = result.unfinished.length === result.solves ? ': none of its runs finished' : '';
        lines.push(`${target.text} is not met for any ${opts.adjust} in [${opts.min}, ${opts.max}]${none}`);
        if (result.best) lines.push(`  closest: ${opts.adjust} = ${formatSignificant(result.best.value)} gives ${target.pathText} = ${readingText(result.best.reading)}`);
      }
      // a run that did not finish counts as not meeting the target: say how many, and why the first one stopped
      const first = result.unfinished[0];
      if (first) {
        lines.push(`  ${result.unfinished.length} of the ${result.solves} runs did not finish (counted as not meeting the target); ` +
          `the first, at ${opts.adjust} = ${formatSignificant(first.value)}: ${first.error}`);
      }
      if (!result.monotonic) {
        lines.push(`  the response is not monotonic: the target is met on ${result.met_intervals.map(([a, b]) => (a === b ? formatSignificant(a) : `${formatSignificant(a)}…${formatSignificant(b)}`)).join(', ')} (scan points); the answer is the ${which} edge`);
      }
      lines.push(`  ${result.solves} runs`, '', `  ${predictionNotCertification}`);
      process.stdout.write(`${lines.join('\n')}\n`);
    });
}
