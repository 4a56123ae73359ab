/**
 * `freezeline window FILE`: the safe operating duration of a scenario (sim/study/window.ts) — the longest hold that
 * keeps a margin below every limit, the shortest hold that melts the separator, the usable window after heat off,
 * and the binding constraint — in sentences, as JSON (`--json`), and the operating chart as CSV (`--csv OUT`).
 */
import { writeFileSync } from 'node:fs';
import type { Command } from 'commander';
import { kToC } from '../physics/units.ts';
import { operatingCsv } from '../study/chart-csv.ts';
import { holdKnob } from '../study/knob.ts';
import { SolveFailure } from '../study/point.ts';
import { searchWindow, windowDefaults, type WindowReport } from '../study/window.ts';
import { windowWords } from '../study/words.ts';
import { predictionNotCertification } from '../observe/wording.ts';
import { assertFinite } from '../observe/result.ts';
import { InputError, readProblem, RunStopped } from './input.ts';

interface WindowFlags { marginK: string; untilLiquid?: string; hold?: string; vary: string; json?: boolean; csv?: string }

function numberFlag(name: string, text: string, ok: (v: number) => boolean, rule: string): number {
  const v = Number(text);
  if (text.trim() === '' || !Number.isFinite(v) || !ok(v)) throw new InputError(`${name}: must be ${rule}, got ${JSON.stringify(text)}`);
  return v;
}

/** The JSON document: the answers first (null where one does not exist), then the detail behind them. */
export function windowJson(r: WindowReport): Record<string, unknown> {
  const shown = (v: number | null | undefined) => (v === null || v === undefined ? null : r.knob.unit === '°C' ? kToC(v) : v);
  const w = r.window;
  const b = r.longest?.binding ?? null;
  const answers = r.knob.vary === 'time'
    ? { longest_hold_s: r.longest?.value ?? null, shortest_hold_s: r.shortest?.value ?? null }
    : { highest_value: shown(r.longest?.value), lowest_value: shown(r.shortest?.value), unit: r.knob.unit };
  return {
    ...answers,
    window_s: w?.point.window_s ?? null,
    until_liquid_s: w?.point.until_liquid_s ?? null,
    solidifying_s: w?.point.solidifying_s ?? null,
    binding: b ? { layer: b.layer, kind: b.kind, at_s: b.at_s } : null,
    solves: r.solves,
    no_limit: r.no_limit,
    reasons: { longest: r.longest_reason, shortest: r.shortest_reason, window: w ? w.reason : 'no value keeps the margin' },
    window_at: w ? { value: shown(w.value), chosen: w.chosen, keeps_margin: w.safe, heat_off_s: w.point.heat_off_s, half_frozen_at_s: w.point.half_frozen_at_s } : null,
    vary: { kind: r.knob.vary, path: r.knob.path, label: r.knob.label, unit: r.knob.unit, from: shown(r.knob.lo), to: shown(r.knob.hi), own: shown(r.knob.own) },
    margin_K: r.margin_K,
    until_liquid: r.until_liquid,
    tolerance: r.tolerance,
    scan_spacing: r.scan_spacing,
    monotonic: r.monotonic,
    safe_intervals: r.safe.map((i) => ({ ...i, from: shown(i.from), to: shown(i.to) })),
    molten_intervals: r.molten.map((i) => ({ ...i, from: shown(i.from), to: shown(i.to) })),
    points: r.points.map((p) => ({ ...p, value: shown(p.value) })),
  };
}

function windowText(name: string, r: WindowReport): string {
  const words = windowWords(r);
  const k = r.knob;
  const lines = [
    `freezeline window — ${name}`,
    '',
    `  varied: ${k.label} (${k.path}); required margin ${r.margin_K} K below every limit`,
    '',
    `  ${words.longest}`,
    `  ${words.shortest}`,
    `  ${words.window}`,
    `  binding: ${words.binding}`,
    '',
    `  keeps the margin: ${words.safeIntervals.length > 0 ? words.safeIntervals.join('; ') : 'nowhere in the range'}`,
    `  separator fully molten: ${words.moltenIntervals.length > 0 ? words.moltenIntervals.join('; ') : 'nowhere in the range'}`,
  ];
  if (!r.monotonic) lines.push('  the response is not monotonic: every interval is listed above; narrower ones between scan points may be missed');
  lines.push(`  ${words.method}`, '', `  ${predictionNotCertification}`);
  return lines.join('\n');
}

export function registerWindow(cli: Command): void {
  cli.command('window').argument('<file>', 'scenario file (JSON)')
    .description('the safe operating duration: longest hold within a margin, shortest hold for a molten separator, usable window after heat off')
    .option('--margin-K <K>', 'required margin below every limit, K', String(windowDefaults.marginK))
    .option('--until-liquid <F>', 'also the window until the separator\'s mean liquid fraction falls below F (0 < F < 1)')
    .option('--hold <s>', 'report the usable window after heat off at this hold, s (default: the longest hold, else the scenario\'s own)')
    .option('--vary <what>', 'time: the hold; power: the heater\'s plate temperature, flux or source at the scenario\'s hold', 'time')
    .option('--json', 'write the answers and the per-run detail as JSON on stdout, nothing else')
    .option('--csv <out>', 'write the operating chart (one row per run) to a CSV file')
    .action((file: string, opts: WindowFlags) => {
      const marginK = numberFlag('--margin-K', opts.marginK, (v) => v >= 0, 'a number ≥ 0');
      const untilLiquid = opts.untilLiquid === undefined ? null : numberFlag('--until-liquid', opts.untilLiquid, (v) => v > 0 && v < 1, 'a liquid fraction between 0 and 1 (exclusive)');
      const hold = opts.hold === undefined ? undefined : numberFlag('--hold', opts.hold, (v) => v >= 0, 'a time ≥ 0 s');
      if (opts.vary !== 'time' && opts.vary !== 'power') throw new InputError(`--vary: must be time or power, got ${JSON.stringify(opts.vary)}`);
      let problem = readProblem(file);
      let at = opts.vary === 'time' ? hold : undefined;
      if (opts.vary === 'power' && hold !== undefined) {
        // --hold with --vary power: search the power at that hold
        const knob = holdKnob(problem);
        if (typeof knob === 'string') throw new InputError(`${file}: ${knob}`);
        if (!(hold >= knob.lo && hold <= knob.hi)) throw new InputError(`--hold: must be within ${knob.lo}–${knob.hi} s for ${knob.path}, got ${hold}`);
        problem = knob.apply(hold);
        at = undefined;
      }
      let result;
      try {
        result = searchWindow(problem, { vary: opts.vary, marginK, untilLiquid, ...(at !== undefined ? { at } : {}) });
      } catch (e) {
        if (e instanceof SolveFailure) {
          // a run of the search that stopped for a physical reason or at the ceiling ends it the same way as `run`
          const stop = e.stop;
          if (stop && stop.reason !== 'numerical') {
            // --json promises a document on stdout: why and where the search stopped (as `run --json` does for a run)
            if (opts.json) {
              const doc = { stopped: { reason: stop.reason, t_s: stop.tS, message: stop.message, vary: opts.vary, at: e.at ?? null } };
              assertFinite(doc, 'stopped search');
              process.stdout.write(`${JSON.stringify(doc)}\n`);
            }
            throw new RunStopped(`${file}: ${e.message}`, stop.reason, stop.tS, stop.message);
          }
          throw new Error(e.message);
        }
        throw e;
      }
      if (!result.ok) throw new InputError(`${file}: ${result.reason}`);
      const r = result.report;
      if (opts.csv) writeFileSync(opts.csv, operatingCsv(r));
      if (opts.json) process.stdout.write(`${JSON.stringify(windowJson(r))}\n`);
      else process.stdout.write(`${windowText(problem.name, r)}\n`);
    });
}
