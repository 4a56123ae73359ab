/**
 * Colours of our own: a temperature scale (cold navy → teal → amber → red) used by both the stack drawing and the
 * position–time map, so one colour means one temperature everywhere; and (from sim/) the layers' line colours.
 */
const TEMPERATURE_STOPS: readonly (readonly [number, readonly [number, number, number]])[] = [
  [0, [28, 42, 84]],
  [0.25, [39, 110, 150]],
  [0.5, [86, 174, 150]],
  [0.7, [236, 193, 80]],
  [0.85, [236, 130, 70]],
  [1, [186, 48, 40]],
];

const hex = (c: readonly [number, number, number]): string => `rgb(${c.map((x) => Math.round(x)).join(',')})`;

/** The colour of a share f in [0, 1] of the temperature range (clamped). */
export function temperatureColour(f: number): string {
  const x = Number.isFinite(f) ? Math.min(Math.max(f, 0), 1) : 0;
  for (let i = 1; i < TEMPERATURE_STOPS.length; i++) {
    const [x1, c1] = TEMPERATURE_STOPS[i]!;
    const [x0, c0] = TEMPERATURE_STOPS[i - 1]!;
    if (x <= x1) {
      const w = (x - x0) / (x1 - x0);
      return hex([c0[0] + w * (c1[0] - c0[0]), c0[1] + w * (c1[1] - c0[1]), c0[2] + w * (c1[2] - c0[2])]);
    }
  }
  return hex(TEMPERATURE_STOPS[TEMPERATURE_STOPS.length - 1]![1]);
}

/** The same scale for Plotly's `colorscale`. */
export const temperatureScale = (): [number, string][] => TEMPERATURE_STOPS.map(([x, c]) => [x, hex(c)]);

/** One colour per layer id: the rule the HTML report uses too (sim/observe/layer-colours.ts). */
export { layerColours } from '../sim/index.ts';

/** A CSS colour `#rrggbb` with transparency, for bands. */
export function translucent(colour: string, alpha: number): string {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(colour);
  if (!m) return colour;
  return `rgba(${parseInt(m[1]!, 16)},${parseInt(m[2]!, 16)},${parseInt(m[3]!, 16)},${alpha})`;
}
