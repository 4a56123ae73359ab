/**
 * The material library: every materials/*.json file, keyed by its `name`.
 * The contents are validated by the loader in sim/, so the type here stays `unknown`.
 */
import alumina from './alumina.json' with { type: 'json' };
import aluminium from './aluminium.json' with { type: 'json' };
import aluminium6061 from './aluminium-6061.json' with { type: 'json' };
import ceramicFibreBlanket from './ceramic-fibre-blanket.json' with { type: 'json' };
import copper from './copper.json' with { type: 'json' };
import eGlass from './e-glass.json' with { type: 'json' };
import fusedSilica from './fused-silica.json' with { type: 'json' };
import graphiteFoil from './graphite-foil.json' with { type: 'json' };
import iron from './iron.json' with { type: 'json' };
import ironDisulfide from './iron-disulfide.json' with { type: 'json' };
import liclKclEutectic from './licl-kcl-eutectic.json' with { type: 'json' };
import magnesia from './magnesia.json' with { type: 'json' };
import magnesium from './magnesium.json' with { type: 'json' };
import micaMuscovite from './mica-muscovite.json' with { type: 'json' };
import micaPhlogopite from './mica-phlogopite.json' with { type: 'json' };
import microporousSilicaBoard from './microporous-silica-board.json' with { type: 'json' };
import mildSteel from './mild-steel.json' with { type: 'json' };
import nickel from './nickel.json' with { type: 'json' };
import stainless304 from './stainless-304.json' with { type: 'json' };

export const libraryMaterialFiles: Readonly<Record<string, unknown>> = {
  alumina,
  aluminium,
  'aluminium-6061': aluminium6061,
  'ceramic-fibre-blanket': ceramicFibreBlanket,
  copper,
  'e-glass': eGlass,
  'fused-silica': fusedSilica,
  'graphite-foil': graphiteFoil,
  iron,
  'iron-disulfide': ironDisulfide,
  'licl-kcl-eutectic': liclKclEutectic,
  magnesia,
  magnesium,
  'mica-muscovite': micaMuscovite,
  'mica-phlogopite': micaPhlogopite,
  'microporous-silica-board': microporousSilicaBoard,
  'mild-steel': mildSteel,
  nickel,
  'stainless-304': stainless304,
};
