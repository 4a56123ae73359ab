/**
 * A material's summary beside its layer: limits and melting range at a glance, then (opened on demand) every
 * property with the published source it came from.
 */
import { h } from './dom.ts';
import { formatNumber } from './format.ts';
import type { Json } from './json.ts';
import type { MaterialInfo } from './materials.ts';

/** A property as text: one number, or the range of a table [[T_C, v], ...]. */
function propertyText(v: Json | undefined, unit: string): string {
  if (typeof v === 'number') return `${formatNumber(v, { significant: 4 })} ${unit}`;
  if (Array.isArray(v)) {
    const rows = v.filter((r): r is number[] => Array.isArray(r) && r.length === 2 && r.every((x) => typeof x === 'number'));
    if (rows.length === 0) return '—';
    const ys = rows.map((r) => r[1]!);
    const ts = rows.map((r) => r[0]!);
    return `${formatNumber(Math.min(...ys), { significant: 3 })}–${formatNumber(Math.max(...ys), { significant: 3 })} ${unit}`
      + ` (table, ${formatNumber(Math.min(...ts), { decimals: 0 })}–${formatNumber(Math.max(...ts), { decimals: 0 })} °C)`;
  }
  return '—';
}

export function limitsText(info: MaterialInfo): string {
  const parts = info.limits.map((l) => `${l.kind} ${formatNumber(l.atC, { decimals: 0 })} °C`);
  return parts.length > 0 ? parts.join(' · ') : 'no limit on file';
}

function meltText(info: MaterialInfo): string | undefined {
  const m = info.melt;
  if (!m) return undefined;
  const range = m.solidusC === m.liquidusC ? `${formatNumber(m.solidusC, { decimals: 0 })} °C`
    : `${formatNumber(m.solidusC, { decimals: 0 })}–${formatNumber(m.liquidusC, { decimals: 0 })} °C`;
  return `melts at ${range}${m.latentJPerKg !== undefined ? `, latent heat ${formatNumber(m.latentJPerKg / 1000, { decimals: 0 })} kJ/kg` : ''}`;
}

export function materialCard(info: MaterialInfo): HTMLElement {
  if (info.origin === 'unknown') {
    return h('div', { class: 'material-card unknown' }, `“${info.name}” is neither in this file nor in the library.`);
  }
  const melt = meltText(info);
  const summary = h('div', { class: 'material-summary' },
    h('span', { class: 'material-title' }, info.title),
    h('span', { class: 'material-limits' }, `limits: ${limitsText(info)}`),
    melt ? h('span', {}, melt) : undefined);
  const rows: [string, string, string | undefined][] = [
    ['thermal conductivity', propertyText(info.k, 'W/(m·K)'), info.sources.k_W_mK],
    ['density', propertyText(info.rho, 'kg/m³'), info.sources.rho_kg_m3],
    ['specific heat', propertyText(info.cp, 'J/(kg·K)'), info.sources.cp_J_kgK],
    ['melting', melt ?? 'does not melt in this model', info.sources.melt],
  ];
  const details = h('details', { class: 'material-sources' },
    h('summary', {}, info.origin === 'library' ? 'properties and sources' : 'properties (defined in this file)'),
    h('table', {}, ...rows.map(([name, value, source]) =>
      h('tr', {}, h('th', {}, name), h('td', {}, value), h('td', { class: 'source' }, source ?? (info.origin === 'file' ? '' : 'no source given'))))),
    info.limits.length > 0 ? h('ul', { class: 'limit-list' }, ...info.limits.map((l) =>
      h('li', {}, h('strong', {}, `${l.kind} at ${formatNumber(l.atC, { decimals: 0 })} °C`),
        l.source ? ` — ${l.source}` : ' — no source given', l.note ? h('div', { class: 'note' }, l.note) : undefined))) : undefined,
    info.notes ? h('p', { class: 'note' }, info.notes) : undefined);
  return h('div', { class: 'material-card' }, summary, details);
}
