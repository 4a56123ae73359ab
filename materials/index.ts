/**
 * The material library: every materials/*.json file, keyed by its `name`.
 * The contents are validated by the loader in sim/, so the type here stays `unknown`.
 */
import alumina from './alumina.json' with { type: 'json' };
import aluminium from './aluminium.json' with { type: 'json' };
import aluminium6061 from './aluminium-6061.json' with { type: 'json' };
import boronNitride from './boron-nitride.json' with { type: 'json' };
import boronNitridePowder from './boron-nitride-powder.json' with { type: 'json' };
import ceramicFibreBlanket from './ceramic-fibre-blanket.json' with { type: 'json' };
import ceramicTile from './ceramic-tile.json' with { type: 'json' };
import copper from './copper.json' with { type: 'json' };
import eGlass from './e-glass.json' with { type: 'json' };
import feKclo4Pellet from './fe-kclo4-pellet.json' with { type: 'json' };
import fusedSilica from './fused-silica.json' with { type: 'json' };
import graphiteFoil from './graphite-foil.json' with { type: 'json' };
import iron from './iron.json' with { type: 'json' };
import ironDisulfide from './iron-disulfide.json' with { type: 'json' };
import kcl from './kcl.json' with { type: 'json' };
import librKbrLifEutectic from './libr-kbr-lif-eutectic.json' with { type: 'json' };
import licl from './licl.json' with { type: 'json' };
import liclKclEutectic from './licl-kcl-eutectic.json' with { type: 'json' };
import lifLiclLibrEutectic from './lif-licl-libr-eutectic.json' with { type: 'json' };
import lithiumAluminium from './lithium-aluminium.json' with { type: 'json' };
import lithiumSilicon from './lithium-silicon.json' with { type: 'json' };
import magnesia from './magnesia.json' with { type: 'json' };
import magnesiaPowder from './magnesia-powder.json' with { type: 'json' };
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
  'boron-nitride': boronNitride,
  'boron-nitride-powder': boronNitridePowder,
  'ceramic-fibre-blanket': ceramicFibreBlanket,
  'ceramic-tile': ceramicTile,
  copper,
  'e-glass': eGlass,
  'fe-kclo4-pellet': feKclo4Pellet,
  'fused-silica': fusedSilica,
  'graphite-foil': graphiteFoil,
  iron,
  'iron-disulfide': ironDisulfide,
  kcl,
  'libr-kbr-lif-eutectic': librKbrLifEutectic,
  licl,
  'licl-kcl-eutectic': liclKclEutectic,
  'lif-licl-libr-eutectic': lifLiclLibrEutectic,
  'lithium-aluminium': lithiumAluminium,
  'lithium-silicon': lithiumSilicon,
  magnesia,
  'magnesia-powder': magnesiaPowder,
  magnesium,
  'mica-muscovite': micaMuscovite,
  'mica-phlogopite': micaPhlogopite,
  'microporous-silica-board': microporousSilicaBoard,
  'mild-steel': mildSteel,
  nickel,
  'stainless-304': stainless304,
};
