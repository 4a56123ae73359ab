/**
 * Probe positions. A scenario may list its own depths (`output.probes_mm`, measured from the bottom face); without
 * them the probes are tied to the stack — the bottom face, each layer's mid-plane, each interface between layers and
 * the top face — so they follow the layers as the user edits thicknesses and never fall outside the stack.
 */

export interface Probe {
  /** Depth from the bottom face, mm (an edge unit: probes are reported in mm). */
  readonly xMm: number;
  /** What the probe marks, in the trade's words: "bottom face", "anode mid-plane", "collector | separator". */
  readonly label: string;
}

interface LayerExtent { readonly id: string; readonly thickness_mm: number }

/** The default probes of a stack, bottom to top. */
export function stackProbes(layers: readonly LayerExtent[]): Probe[] {
  const probes: Probe[] = [{ xMm: 0, label: 'bottom face' }];
  let z = 0;
  layers.forEach((layer, i) => {
    probes.push({ xMm: z + layer.thickness_mm / 2, label: `${layer.id} mid-plane` });
    z += layer.thickness_mm;
    const above = layers[i + 1];
    probes.push({ xMm: z, label: above ? `${layer.id} | ${above.id}` : 'top face' });
  });
  return probes;
}

/** Labels for depths the user chose: the layer a depth falls in, or the face or interface it sits on. */
export function labelDepths(depthsMm: readonly number[], layers: readonly LayerExtent[]): Probe[] {
  const marks = stackProbes(layers);
  return depthsMm.map((x) => {
    const onMark = marks.find((m) => m.xMm === x && !m.label.endsWith('mid-plane'));
    if (onMark) return { xMm: x, label: onMark.label };
    let z = 0;
    for (const layer of layers) {
      if (x < z + layer.thickness_mm) return { xMm: x, label: `in ${layer.id}` };
      z += layer.thickness_mm;
    }
    return { xMm: x, label: 'top face' };
  });
}
