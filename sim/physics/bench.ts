/**
 * A bench surface under a face: a semi-infinite solid of a named material (a ceramic tile, a steel bench) that the
 * face rests on after it is lifted off the heater, through an optional contact conductance h_c (perfect contact
 * without one). The solid obeys ρc·∂T/∂t = k·∂²T/∂x² with constant k, ρ, c read at one temperature (the bench's
 * starting temperature), so it is LINEAR.
 *
 * It is discretised as a chain of N finite-volume cells graded geometrically from the face (ratio r, the first the
 * thinnest), deep enough to act as semi-infinite until the end of the run: depth = 4·√(α·t_rest), with t_rest the
 * time from the segment's start to the end of the run. At that depth a semi-infinite solid has seen erfc(2) ≈ 0.5 %
 * of a step at its surface by the end of the run (about twice that at the chain's insulated far end, its image), and
 * the insulated far end changes the surface heat flux by a term of order exp(−depth²/(α·t)) = e⁻¹⁶ ≈ 1e−7 (the image
 * series of a slab with an insulated far face, Carslaw & Jaeger, Conduction of Heat in Solids, 2nd ed.; from memory).
 *
 * Conductances (W·m⁻²·K⁻¹): face → cell 0: 1/g₀ = 1/h_c + Δx₀/(2k); cell i−1 → cell i: 1/gᵢ = (Δxᵢ₋₁ + Δxᵢ)/(2k).
 * Each implicit stage of the time step reads cᵢ·(Tᵢ − bᵢ) = d·h·(net conduction into cell i), cᵢ = ρc·Δxᵢ, with b
 * known from earlier stages (time/bench-chain.ts sets b and solves). The chain being linear, its stage solution is
 * affine in the face temperature: T = x⁰ + T_face·x¹ (in the rise above the start temperature), found by two tridiagonal solves with the same matrix. The face
 * then sees exactly q(T_face) = g₀·(x⁰₀ + T_face·x¹₀ − T_face), dq/dT_face = g₀·(x¹₀ − 1), as a heater plate's face
 * does (heater.ts), and the chain's state is recovered after the stage from the face temperature the stack solved.
 */
import type { Material } from './material.ts';

export const benchDefaults = {
  /** Depth of the chain in diffusion lengths √(α·t_rest): the far end changes the surface flux by ~e⁻¹⁶ (see above). */
  depthDiffusionLengths: 4,
  /** Cells of the chain: with the growth ratio below, the first cell is 1/3035 of the depth. */
  cells: 60,
  /** Growth ratio of consecutive cells: 10 % keeps the non-uniform-grid error of the fluxes small (first order in r − 1). */
  growth: 1.1,
  /** Shortest time a chain is built for, s: a bench placed at the very end of a run still gets cells of nonzero width. */
  minRestS: 1e-3,
} as const;

/** The bench under a face during a segment: constant properties, its chain of cells, and its starting temperature. */
export interface Bench {
  /** The bench material (its library record, for the coefficient trace). */
  readonly material: Material;
  /** Conductivity k, W·m⁻¹·K⁻¹, and volumetric heat capacity ρc_p, J·m⁻³·K⁻¹, read at propertiesAtK. */
  readonly conductivityWPerMK: number;
  readonly capacityJPerM3K: number;
  readonly propertiesAtK: number;
  /** Contact conductance face → bench, W·m⁻²·K⁻¹; undefined: perfect contact. */
  readonly contactWPerM2K: number | undefined;
  /** Temperature of the whole bench when the face is set on it, K. */
  readonly startK: number;
  /** Thickness of a bench insulated beneath, m; undefined: semi-infinite. */
  readonly thicknessM?: number | undefined;
}

/** Effusivity e = √(k·ρc), W·s^½·m⁻²·K⁻¹: what sets the interface temperature of two solids in contact. */
export const effusivity = (b: Bench): number => Math.sqrt(b.conductivityWPerMK * b.capacityJPerM3K);

/**
 * Cell widths (m) of a chain as deep as the rule above for a bench of diffusivity alphaM2PerS over restS seconds, or
 * as thick as the bench when it is thinner (a slab insulated beneath).
 */
export function benchChainWidths(alphaM2PerS: number, restS: number, thicknessM?: number, d = benchDefaults): Float64Array {
  // a bench thinner than the rule's depth is the chain itself, its far end insulated
  const depth = Math.min(thicknessM ?? Infinity, d.depthDiffusionLengths * Math.sqrt(alphaM2PerS * Math.max(restS, d.minRestS)));
  const first = (depth * (d.growth - 1)) / (d.growth ** d.cells - 1);
  return Float64Array.from({ length: d.cells }, (_, i) => first * d.growth ** i);
}

/** The chain during a run: mutable, one per face, owned by the solver's workspace. */
export interface BenchNode {
  /** The bench this chain holds (undefined: none attached yet). */
  bench: Bench | undefined;
  /**
   * Cell temperatures above the bench's start temperature at the start of the current step (the last accepted state),
   * K. The chain works in this rise θ = T − T_start, not in T: its stage matrix amplifies round-off by its condition
   * number (≈ d·h·g/c of the thin face-side cells), and the rise keeps that round-off relative to the heat moved
   * rather than to 300 K (the ledger then closes to ~1e−12 of the bench heat even for a 2 K difference).
   */
  riseK: Float64Array;
  /** Stage constants b (rise, K), and the stage's effective step d·h, s (0: the chain is held, the face balances only). */
  b: Float64Array;
  hd: number;
  /** The stage solution θ = x0 + θ_face·x1 (K and K/K), θ_face = T_face − T_start. */
  x0: Float64Array;
  x1: Float64Array;
  /** Cell widths from the face down, m (their sum is the chain's depth). */
  widthsM: Float64Array;
  /** Areal heat capacity ρc·Δx per cell, J·m⁻²·K⁻¹, and the conductances g₀ (face → cell 0) … g_{N−1}, W·m⁻²·K⁻¹. */
  cap: Float64Array;
  g: Float64Array;
}

export function createBenchNode(): BenchNode {
  const none = new Float64Array(0);
  return { bench: undefined, riseK: none, b: none, hd: 0, x0: none, x1: none, widthsM: none, cap: none, g: none };
}

/** Diffusivity α = k/(ρc_p) of the bench, m²/s. */
export const benchDiffusivity = (b: Bench): number => b.conductivityWPerMK / b.capacityJPerM3K;

/**
 * Sets the node up for a bench just placed under the face, restS seconds before the end of the run (the chain is
 * built deep enough for that time, wherever the segment was moved to): every cell at the bench's starting temperature.
 */
export function placeBench(node: BenchNode, bench: Bench, restS: number): void {
  const w = benchChainWidths(benchDiffusivity(bench), restS, bench.thicknessM);
  const n = w.length;
  const k = bench.conductivityWPerMK;
  node.bench = bench;
  node.widthsM = w;
  node.riseK = new Float64Array(n);
  node.b = new Float64Array(n);
  node.x0 = new Float64Array(n);
  node.x1 = new Float64Array(n);
  node.hd = 0;
  node.cap = Float64Array.from(w, (dx) => bench.capacityJPerM3K * dx);
  node.g = new Float64Array(n);
  const contactR = bench.contactWPerM2K === undefined ? 0 : 1 / bench.contactWPerM2K;
  node.g[0] = 1 / (contactR + w[0]! / (2 * k));
  for (let i = 1; i < n; i++) node.g[i] = (2 * k) / (w[i - 1]! + w[i]!);
}

/** Heat into the face from the bench in the current stage, W/m² (negative: the face loses heat to it); writes dq/dT_face to out[0]. */
export function benchHeatIn(node: BenchNode, faceK: number, out: Float64Array): number {
  const g0 = node.g[0]!;
  const face = faceK - node.bench!.startK;
  out[0] = g0 * (node.x1[0]! - 1);
  return g0 * (node.x0[0]! + face * node.x1[0]! - face);
}

/** Heat the bench holds above its starting temperature, J/m² (it came through the face). */
export function benchStoredJPerM2(node: BenchNode): number {
  const bench = node.bench;
  if (!bench) return 0;
  let sum = 0;
  for (let i = 0; i < node.riseK.length; i++) sum += node.cap[i]! * node.riseK[i]!;
  return sum;
}
