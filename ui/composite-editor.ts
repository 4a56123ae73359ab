/**
 * A salt-soaked separator as a material kind of the stack editor: a porous matrix from the library whose pores a salt
 * fills (a library salt, or a LiCl–KCl mixture by composition), given by porosity and fill. The panel edits the
 * scenario's own `materials.<name>.composite` entry and shows the effective properties the core builds from it
 * (sim/scenario/material-kinds.ts → sim/physics/composite.ts, through sim/index.ts): the view holds no copy of the
 * mixing rules. Test hooks: `composite-<i>` (the panel of layer i), `composite-matrix-<i>`, `composite-salt-<i>`,
 * `composite-licl-<i>`, `composite-basis-<i>`, `composite-porosity-<i>`, `composite-fill-<i>`, and the computed
 * `composite-rho-<i>`, `composite-k-solid-<i>`, `composite-k-liquid-<i>`, `composite-latent-<i>`, `composite-melt-<i>`.
 */
import { formatNumber, formatTemperature, kToC, libraryMaterial, libraryNames, liquidusModel } from '../sim/index.ts';
import type { DraftStore } from './draft.ts';
import { append, h } from './dom.ts';
import { fieldWrapper, numberField } from './fields.ts';
import { asList, asObject, asString, isObject, type Json, type JsonObject } from './json.ts';
import { modelledMaterial } from './materials.ts';

export const compositeEditorDefaults = {
  /**
   * Matrices offered first, with the words a cell builder uses. They are the dense solids (README, "A salt-soaked
   * separator"): the pores are the composite's porosity, so a library entry that is itself a porous pressed powder
   * would count its pores twice.
   */
  matrices: [
    ['e-glass', 'glass cloth (E-glass fibres)'],
    ['magnesia', 'MgO powder (dense MgO grains)'],
    ['boron-nitride', 'BN powder (dense h-BN grains)'],
  ] as const,
  /** Library salts offered first (the rest of the melting library follows under its own heading). */
  salts: ['licl-kcl-eutectic', 'lif-licl-libr-eutectic', 'libr-kbr-lif-eutectic', 'licl', 'kcl'] as const,
  /** A new entry: glass cloth, 60 % porosity, the LiCl–KCl eutectic (an invented starting point, like the demo's). */
  start: { matrix: 'e-glass', salt: 'licl-kcl-eutectic', porosity: 0.6 },
  /** Digits kept of the LiCl fraction written when switching to a mixture (the model's eutectic, 0.585). */
  mixtureDigits: 3,
} as const;

/** The material select's choice that turns a layer into a new salt-soaked matrix. */
export const NEW_COMPOSITE = '(new salt-soaked matrix)';
const MIXTURE = '(LiCl–KCl by composition)';

/** The draft's composite entry of this name, if the material is one. */
export function compositeEntry(draft: JsonObject, name: string): JsonObject | undefined {
  const entry = asObject(draft.materials)[name];
  return isObject(entry) && isObject(entry.composite) ? entry.composite : undefined;
}

function freshName(draft: JsonObject, layerId: string): string {
  const stem = `${layerId.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'separator'}-soaked`;
  const taken = new Set([...Object.keys(asObject(draft.materials)), ...libraryNames()]);
  for (let n = 1; ; n++) {
    const name = n === 1 ? stem : `${stem}-${n}`;
    if (!taken.has(name)) return name;
  }
}

/** Gives layer i a new composite material of its own (the starting point above); returns its name. */
export function addComposite(draft: JsonObject, i: number): string {
  const layer = asList(draft.layers)[i];
  const name = freshName(draft, asString(asObject(layer).id) ?? '');
  if (!isObject(draft.materials)) draft.materials = {};
  draft.materials[name] = { composite: { ...compositeEditorDefaults.start } };
  if (isObject(layer)) layer.material = name;
  return name;
}

const melts = (name: string): boolean => libraryMaterial(name)?.melt !== undefined;

function option(value: string, label: string, current: string): HTMLOptionElement {
  return h('option', { value, selected: value === current }, label);
}

function group(label: string, names: readonly string[], current: string): HTMLOptGroupElement | undefined {
  return names.length > 0 ? h('optgroup', { label }, ...names.map((n) => option(n, n, current))) : undefined;
}

function matrixSelect(store: DraftStore, base: string, i: number): HTMLElement {
  const current = asString(store.get(`${base}.matrix`)) ?? '';
  const first = compositeEditorDefaults.matrices.map(([n]) => n as string);
  const others = libraryNames().filter((n) => !first.includes(n) && !melts(n));
  const known = [...first, ...others].includes(current);
  const select = h('select', { 'data-path': `${base}.matrix`, 'data-testid': `composite-matrix-${i}`, 'aria-label': 'matrix' },
    known ? undefined : option(current, `${current || '(none)'} — not in the library`, current),
    h('optgroup', { label: 'separator matrices' }, ...compositeEditorDefaults.matrices.map(([n, label]) => option(n, `${label} — ${n}`, current))),
    group('other solids that do not melt', others, current));
  select.addEventListener('change', () => store.change((d) => { setIn(d, base, 'matrix', select.value); }));
  return fieldWrapper('matrix', undefined, 'The porous solid: a cloth or a pressed powder, as its dense material.', select);
}

function saltSelect(store: DraftStore, base: string, i: number): HTMLElement {
  const salt = store.get(`${base}.salt`);
  const current = isObject(salt) ? MIXTURE : asString(salt) ?? '';
  const first = compositeEditorDefaults.salts.filter((n) => libraryNames().includes(n)) as string[];
  const others = libraryNames().filter((n) => !first.includes(n) && melts(n));
  const known = current === MIXTURE || [...first, ...others].includes(current);
  const select = h('select', { 'data-path': `${base}.salt`, 'data-testid': `composite-salt-${i}`, 'aria-label': 'salt' },
    known ? undefined : option(current, `${current || '(none)'} — not in the library`, current),
    option(MIXTURE, 'LiCl–KCl mixture, by composition', current),
    group('library salts', first, current),
    group('other library materials that melt', others, current));
  select.addEventListener('change', () => store.change((d) => {
    if (select.value !== MIXTURE) { setIn(d, base, 'salt', select.value); return; }
    // a new mixture starts at the model's own eutectic (sim/physics/salt.ts)
    const x = Number(liquidusModel().eutectic.xLiCl.toFixed(compositeEditorDefaults.mixtureDigits));
    setIn(d, base, 'salt', { LiCl: x, KCl: complement(x), basis: 'mole' });
  }));
  return fieldWrapper('salt', undefined, 'The salt in the pores: a library salt, or LiCl–KCl by composition (its melting range from the liquidus model).', select);
}

/** 1 − x without the round-off tail (1 − 0.585 prints as 0.41500000000000004). */
const complement = (x: number): number => Number((1 - x).toPrecision(12));

function setIn(d: JsonObject, base: string, key: string, value: Json): void {
  const [, name] = /^materials\.(.+)\.composite$/.exec(base) ?? [];
  const c = name === undefined ? undefined : compositeEntry(d, name);
  if (c) c[key] = value;
}

function mixtureFields(store: DraftStore, base: string, i: number, recompute: () => void): HTMLElement[] {
  const salt = asObject(store.get(`${base}.salt`));
  const kcl = h('span', { class: 'composite-kcl' }, `KCl ${formatNumber(salt.KCl, { significant: 4 })}`);
  const licl = numberField(store, {
    path: `${base}.salt.LiCl`, label: 'LiCl fraction', testid: `composite-licl-${i}`, hint: 'LiCl share of the mixture; KCl is the rest.',
    write: (value, input) => {
      store.editField(`${base}.salt.LiCl`, (d) => {
        const s = asObject(asObject(compositeEntry(d, nameOf(base))).salt);
        if (value === undefined) delete s.LiCl;
        else s.LiCl = value;
        if (typeof value === 'number') s.KCl = complement(value);
      }, input);
      kcl.textContent = `KCl ${formatNumber(asObject(store.get(`${base}.salt`)).KCl, { significant: 4 })}`;
      recompute();
    },
  });
  const basis = h('select', { 'data-path': `${base}.salt.basis`, 'data-testid': `composite-basis-${i}`, 'aria-label': 'fractions by' },
    option('mole', 'mole fractions', asString(salt.basis) ?? 'mole'), option('mass', 'mass fractions', asString(salt.basis) ?? 'mole'));
  basis.addEventListener('change', () => { store.setField(`${base}.salt.basis`, basis.value, { source: basis }); recompute(); });
  return [licl, kcl, fieldWrapper('fractions by', undefined, undefined, basis)];
}

const nameOf = (base: string): string => /^materials\.(.+)\.composite$/.exec(base)?.[1] ?? '';

function effectiveView(store: DraftStore, name: string, i: number): { root: HTMLElement; update: () => void } {
  const root = h('div', { class: 'composite-effective', 'data-testid': `composite-effective-${i}` });
  const update = (): void => {
    const built = modelledMaterial(store.current(), name);
    if (!built.ok) {
      root.replaceChildren(h('span', { class: 'note' }, `Effective properties: not computed — ${built.errors.join('; ')}.`));
      return;
    }
    const m = built.material;
    const melt = m.melt;
    const item = (label: string, testid: string, value: string) =>
      h('span', { class: 'composite-value' }, `${label} `, h('strong', { 'data-testid': `${testid}-${i}` }, value));
    root.replaceChildren();
    append(root,
      h('span', { class: 'composite-head' }, 'effective (computed):'),
      item('ρ', 'composite-rho', `${formatNumber(m.density, { significant: 4 })} kg/m³`),
      melt ? item('k solid', 'composite-k-solid', `${formatNumber(melt.kSolid, { significant: 3 })} W/(m·K)`) : undefined,
      melt ? item('k liquid', 'composite-k-liquid', `${formatNumber(melt.kLiquid, { significant: 3 })} W/(m·K)`) : undefined,
      melt ? item('latent heat', 'composite-latent', `${formatNumber(melt.latentJPerKg / 1000, { significant: 3 })} kJ/kg`) : undefined,
      melt ? item('melts', 'composite-melt', melt.solidusK === melt.liquidusK ? formatTemperature(kToC(melt.solidusK), '—')
        : `${formatTemperature(kToC(melt.solidusK), '—')} to ${formatTemperature(kToC(melt.liquidusK), '—')}`) : undefined,
      h('details', { class: 'material-sources' }, h('summary', {}, 'how each value is computed'),
        h('table', {}, ...Object.entries(m.sources).map(([key, source]) => h('tr', {}, h('th', {}, key), h('td', { class: 'source' }, source))))));
  };
  update();
  return { root, update };
}

/** The panel under layer i whose material `name` is a composite entry of the draft. */
export function compositePanel(store: DraftStore, i: number, name: string): HTMLElement {
  const base = `materials.${name}.composite`;
  const effective = effectiveView(store, name, i);
  const recompute = effective.update;
  const num = (key: string, label: string, hint: string, placeholder?: string) => numberField(store, {
    path: `${base}.${key}`, label, testid: `composite-${key}-${i}`, hint, placeholder,
    write: (value, input) => { store.setField(`${base}.${key}`, value, { source: input }); recompute(); },
  });
  const isMixture = isObject(store.get(`${base}.salt`));
  return h('div', { class: 'composite-panel', 'data-testid': `composite-${i}` },
    h('div', { class: 'composite-title' }, `salt-soaked matrix “${name}” (in this file)`),
    h('div', { class: 'composite-fields' },
      matrixSelect(store, base, i),
      saltSelect(store, base, i),
      ...(isMixture ? mixtureFields(store, base, i, recompute) : []),
      num('porosity', 'porosity', 'Pore volume over the whole volume, 0 to 1.'),
      num('fill', 'fill', 'Share of the pores the salt fills, 0 to 1 (the rest is air); empty: 1.', '1')),
    effective.root);
}
