/**
 * `run --report OUT.html`: a one-page, self-contained HTML report of a run — the scenario, the verdicts with their
 * definitions, each layer's margin, the stated expectations, two charts drawn as inline SVG (no script, no network,
 * nothing fetched), and the cautions. Words from sim/observe/wording.ts, numbers through sim/observe/format.ts, so the report says
 * exactly what the terminal table says.
 */
import type { ExpectationOutcome } from '../scenario/expect.ts';
import { formatEnergy, formatImbalance, formatMargin, formatNumber, formatTemperature, formatTime } from '../observe/format.ts';
import type { Problem } from '../physics/problem.ts';
import type { RunRecord } from '../observe/record.ts';
import { kToC, mToMm } from '../physics/units.ts';
import type { Summary } from '../observe/verdict.ts';
import {
  expectationWords, hazards, hazardsHeading, marginWords, noValueWords, predictionNotCertification, terms, verdictTerms,
  windowStatusWords,
} from '../observe/wording.ts';
import { layerColours } from '../observe/layer-colours.ts';
import { lineChart } from './report-svg.ts';
import { convectionSentence, isRayleighDetail } from './table.ts';

export const reportDefaults = {
  /** Draw times in minutes from this duration on, as the table does. */
  minutesFromS: 600,
} as const;

const esc = (s: string): string => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const td = (cells: readonly string[]): string => `<tr>${cells.map((c) => `<td>${esc(c)}</td>`).join('')}</tr>`;
const th = (cells: readonly string[]): string => `<tr>${cells.map((c) => `<th>${esc(c)}</th>`).join('')}</tr>`;

const STYLE = `body{font:14px/1.45 system-ui,sans-serif;max-width:760px;margin:24px auto;padding:0 16px;color:#222}
h1{font-size:20px}h2{font-size:16px;margin-top:22px;border-bottom:1px solid #ccc}
table{border-collapse:collapse;width:100%}td,th{border-bottom:1px solid #e3e3e3;padding:3px 6px;text-align:left;vertical-align:top}
.caution{border:2px solid #b03a1a;background:#fff6f0;padding:8px 12px}.unmet{color:#b03a1a;font-weight:bold}
.small{font-size:12px;color:#555}@media print{body{margin:0}svg{max-width:100%;height:auto}}`;

export interface ReportInput {
  readonly file: string;
  readonly description: string | undefined;
  readonly problem: Problem;
  readonly summary: Summary;
  readonly record: RunRecord;
  readonly expectations: readonly ExpectationOutcome[];
}

export function htmlReport(r: ReportInput): string {
  const { problem: p, summary: s, record } = r;
  const sep = s.separator;
  const minutes = p.durationS >= reportDefaults.minutesFromS;
  const xScale = minutes ? 60 : 1;
  const xLabel = minutes ? 'time (min)' : 'time (s)';
  const markers = s.heat_off_s !== null && s.heat_off_s > 0 ? [{ x: s.heat_off_s, label: verdictTerms.heat_off_s.term.replace(/ at$/, '') }] : [];
  // each layer in the colour the view gives it (observe/layer-colours.ts)
  const colours = layerColours(record.layers.map((l) => l.id));
  const colour = (id: string): string => colours.get(id)!;
  const temperatures = lineChart({
    title: 'Hottest point of each layer', xLabel, yLabel: 'temperature (°C)', xScale, markers,
    series: record.layers.map((l) => ({ name: l.id, x: record.tS, y: l.maxC, colour: colour(l.id) })),
  });
  // layers that melt at some time in this run (or are the separator): a line stuck at 0 says nothing
  const melting = record.layers.map((l, i) => ({ l, i }))
    .filter(({ l, i }) => l.liquidFraction && (p.layers[i]!.separator || l.liquidFraction.some((f) => f > 0)));
  const liquid = melting.length === 0 ? '' : lineChart({
    title: `${terms.liquidFraction.term} (volume mean)`, xLabel, yLabel: `${terms.liquidFraction.term} (0–1)`, xScale, markers,
    series: melting.map(({ l }) => ({ name: l.id, x: record.tS, y: l.liquidFraction!, colour: colour(l.id) })),
  });
  const verdictRows = [
    [verdictTerms.heat_off_s, formatTime(s.heat_off_s, noValueWords.heat_off_s)],
    [verdictTerms.molten_at_s, formatTime(sep.molten_at_s, noValueWords.molten_at_s)],
    [verdictTerms.half_frozen_at_s, formatTime(sep.half_frozen_at_s, noValueWords.half_frozen_at_s)],
    [verdictTerms.frozen_at_s, formatTime(sep.frozen_at_s, noValueWords.frozen_at_s)],
    [verdictTerms.safe_window_s, s.safe_window_s !== null ? formatTime(s.safe_window_s, '') : windowStatusWords[s.safe_window_status].sentence],
  ] as const;
  const note = convectionSentence(p, record);
  const e = s.energy;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>freezeline report — ${esc(p.name)}</title><style>${STYLE}</style></head>
<body>
<h1>freezeline report — ${esc(p.name)}</h1>
<p class="small">Scenario file ${esc(r.file)}. ${esc(predictionNotCertification)}</p>
${r.description ? `<p>${esc(r.description)}</p>` : ''}
<h2>Scenario</h2>
<p>Duration ${esc(formatTime(p.durationS, ''))}; ${esc(terms.ambient.term)} ${esc(formatTemperature(kToC(p.ambientK), ''))}; initial ${esc(formatTemperature(kToC(p.initialK), ''))}${p.footprint ? `; footprint ${esc(formatNumber(p.footprint.areaM2 * 1e6, { significant: 4 }))} mm²` : ''}.</p>
<table>${th([`${terms.layer.term} (bottom to top)`, 'material', 'thickness', 'role'])}
${p.layers.map((l) => td([l.id, l.material.name, `${formatNumber(mToMm(l.thicknessM), { significant: 4 })} mm`, l.separator ? terms.separator.term : ''])).join('\n')}</table>
<h2>Verdicts</h2>
<table>${th(['verdict', 'value', 'definition'])}
${verdictRows.map(([t, v]) => td([t.term, v, t.definition])).join('\n')}</table>
<h2>Layers against their limits</h2>
<table>${th([terms.layer.term, verdictTerms.peak_C.term, 'at', 'binding limit', verdictTerms.margin_K.term, ''])}
${Object.entries(s.layers).map(([id, v]) => td([id, formatTemperature(v.peak_C, ''), formatTime(v.peak_at_s, ''),
    v.limit ? `${v.limit.kind} ${formatNumber(v.limit.at_C, { decimals: 0 })} °C` : noValueWords.limit, formatMargin(v.margin_K, noValueWords.margin_K),
    v.margin_K !== null && v.margin_K <= 0 ? marginWords.reached : id === s.binding_layer ? marginWords.binding : ''])).join('\n')}</table>
${r.expectations.length === 0 ? '' : `<h2>Stated expectations</h2>
<table>${th(['outcome', 'statement', 'run gave'])}
${r.expectations.map((o) => `<tr${o.met ? '' : ' class="unmet"'}><td>${esc(o.met ? expectationWords.pass : expectationWords.fail)}</td><td>${esc(o.statement)}</td><td>${esc(o.actual)}</td></tr>`).join('\n')}</table>`}
<h2>Charts</h2>
${temperatures}
${liquid}
<p class="small">${esc(verdictTerms.energy.term)}: in ${esc(formatEnergy(e.in_J_m2))}, out ${esc(formatEnergy(e.out_J_m2))}, stored ${esc(formatEnergy(e.stored_J_m2))}, relative imbalance ${esc(formatImbalance(e.imbalance_rel))}.${e.edge_out_J_m2 === undefined ? '' : ` Of which through the side walls (edges): in ${esc(formatEnergy(e.edge_in_J_m2 ?? 0))}, out ${esc(formatEnergy(e.edge_out_J_m2))}.`}</p>
${note ? `<p class="small">Note: ${esc(note)}</p>` : ''}
${record.warnings.filter((w) => !(note && isRayleighDetail(w))).map((w) => `<p class="small">Warning: ${esc(w)}</p>`).join('\n')}
${note ? `<details class="small"><summary>Convection details</summary>${record.warnings.filter(isRayleighDetail).map((w) => `<p>${esc(w)}</p>`).join('')}</details>` : ''}
<h2>${esc(hazardsHeading)}</h2>
<div class="caution"><ul>${hazards.map((h) => `<li><strong>${esc(h.term)}:</strong> ${esc(h.definition)}</li>`).join('')}</ul>
<p><strong>${esc(predictionNotCertification)}</strong></p></div>
</body></html>
`;
}
