/**
 * The heater as a body: a plate of thermal mass under a face of the stack, heated electrically with a power P limited
 * to P_max, coupled to the face through a contact conductance G_c, and losing heat to the surroundings through a linear
 * loss coefficient h_loss. Per unit footprint area A (W/m², J/m²), with c′ = ρ·c_p·t_plate:
 *   c′·dT_p/dt = p − G_c·(T_p − T_face) − h_loss·(T_p − T_∞),     p = P/A
 * (a lumped-capacitance node, Incropera et al., Fundamentals of Heat and Mass Transfer, §5.1–5.3; valid while the
 * plate's Biot number h·t/k is small, which a metal plate a few millimetres thick meets).
 *
 * Each implicit stage of the time step reads c′·(T_p − b) = d·h·f(T_p, T_face), with b known from earlier stages. With
 * p fixed over the step (it changes only at state events; a thermostat held in its band is the exception, plateStage)
 * this is linear in T_p, so T_p is eliminated per stage:
 *   T_p = (c′·b + d·h·(p + G_c·T_face + h_loss·T_∞)) / (c′ + d·h·(G_c + h_loss))
 * and the face sees q(T_face) = G_c·(T_p − T_face), dq/dT_face = G_c·(d·h·G_c/(c′ + d·h·(G_c + h_loss)) − 1).
 * The tridiagonal structure and the exact energy ledger of the stack are kept; T_p is recovered after each stage.
 */

/** What the controller reads: the plate itself, or the mean temperature of a layer of the stack. */
export type HeaterSensor =
  | { readonly kind: 'plate' }
  | { readonly kind: 'layer'; readonly index: number; readonly id: string };

/** How the power is chosen. */
export type HeaterControl =
  | { readonly kind: 'constant' }
  | {
      /** Full power below set-point − band, none from the set-point up, switching only at the two levels. */
      readonly kind: 'on-off';
      /** Hysteresis band, K (> 0). */
      readonly bandK: number;
      readonly sensor: HeaterSensor;
    }
  | {
      /**
       * A sampled PI controller (the textbook positional form, e.g. Åström & Hägglund, PID Controllers, 2nd ed., §3.2):
       * every periodS the sensor is read and P = K·(e + ∫e dt / T_i), e = set-point − sensor, held until the next
       * sample and limited to [0, P_max]; the integral stops growing while the output is at a limit (anti-windup by
       * conditional integration).
       */
      readonly kind: 'pi';
      /** Proportional gain K, W/K. */
      readonly gainWPerK: number;
      /** Integral time T_i, s. */
      readonly integralS: number;
      /** Sampling period, s: every sample is a breakpoint of the time loop. */
      readonly periodS: number;
      readonly sensor: HeaterSensor;
    };

export const heldThermostatDefaults = {
  /**
   * An on-off thermostat that reads its plate is held in its band (time/plates.ts) once it has switched heldSwitches
   * times within heldWithinS, while the relay's cycle mean as estimated by relayCycle lies within heldLeanShare × band
   * (or the run's numerics.tolerance_K, if larger) of the band's middle: ten cycles of 0.1 s or less (a fifth of the
   * 0.5 s to which the separator's events are asked by default, scenario/accuracy.ts), whose mean the middle of the
   * band stands for. Followed one by one, such a relay costs 72 000 located switches an hour or more. Measured with 20
   * switches within 3 s instead (cycles of 0.3 s): a 10.3 K band on a 1.1 mm tile plate was held (estimated lean 3 % of
   * the band) and its separator melted 6 s early, the face's ripple, which the estimate leaves out, leaning the
   * followed plate further.
   */
  heldSwitches: 20,
  heldWithinS: 1,
  heldLeanShare: 0.05,
  /**
   * The hold lets go once the relay's estimated cycle would last longer than this, s (five times the longest mean
   * cycle that begins a hold: the estimate leaves out the face moving with the plate, and estimate and observation must
   * not make a hold begin and end over and over), or once its mean leans from the middle by twice what begins one,
   * or once the plate has been out of the band for longer than heldWithinS. Near a level the plate cannot pass (the
   * face at the foot of the band, or full power barely reaching the set-point) the cycle grows without bound and the
   * mean leans to that level: such a relay is slow, or stuck on or off, not fast.
   */
  letGoPeriodS: 0.5,
  /** Width of the held law as a share of the band, centred on its middle: the plate stays within 5 % of the band of it. */
  heldWidthShare: 0.1,
  /**
   * A slower relay is held too when it has switched heldSwitches times within heldQuietWithinS (ten cycles of 0.5 s or
   * less) and the ripple it sends into the stack is small: the largest amplitude over the stack's nodes, from the
   * band's sawtooth at the observed period (time/relay-ripple.ts, the linear periodic regime), at most heldRippleShare
   * of numerics.tolerance_K. What the hold leaves out is then that ripple, below what the run resolves. It lets go
   * when its estimated cycle passes letGoPeriodS × heldQuietWithinS / heldWithinS, or the ripple at that cycle twice
   * the share, besides the lean and the plate out of its band as above. Our own rule, measured: a relay every 0.15 s
   * on an iron-disulfide plate behind a contact of 114 W/m²K (fuzz body seed 37 case 209, ripple 0.02 K) is held,
   * and the 10.3 K band on a 1.1 mm tile plate above is not.
   */
  heldQuietWithinS: 5,
  heldRippleShare: 0.5,
} as const;

/** One point of the set-point schedule: linear between points (ramps), held before the first and after the last. */
export interface SetPoint {
  readonly atS: number;
  readonly tK: number;
}

export interface Heater {
  /** Electric power limit, W, and the same over the footprint, W/m². */
  readonly powerW: number;
  readonly powerWPerM2: number;
  /** Footprint area the plate covers, m² (the stack's footprint). */
  readonly areaM2: number;
  /** Areal heat capacity of the plate ρ·c_p·t, J·m⁻²·K⁻¹ (c_p at a fixed temperature: see heaterPlateCapacity). */
  readonly capacityJPerM2K: number;
  /** Contact conductance plate → face, W·m⁻²·K⁻¹. */
  readonly contactWPerM2K: number;
  /** Loss from the plate to the surroundings per footprint area, W·m⁻²·K⁻¹, and the temperature it loses to, K. */
  readonly lossWPerM2K: number;
  readonly lossToK: number;
  readonly control: HeaterControl;
  /** Empty for constant power. */
  readonly setPoints: readonly SetPoint[];
}

/** The plate during a run: mutable, one per face, owned by the solver's workspace. */
export interface PlateNode {
  /** Plate temperature at the start of the current step (the last accepted state), K. */
  tK: number;
  /** Stage constants: the explicit part b (K) and the stage's effective step d·h (s); d·h = 0 balances the face only. */
  b: number;
  hd: number;
  /**
   * Power over the footprint during the current step, W/m². Not read while the thermostat is held in its band (`held`):
   * the held law's power is solved within each stage (plateStage).
   */
  powerWPerM2: number;
  /**
   * Whether an on-off thermostat that cycles too fast to follow is replaced by its mean (time/plates.ts): the power
   * then follows the plate's temperature within each stage (the held law, plateStage).
   */
  held: boolean;
  /** The thermostat's two levels, set-point − band and set-point, at the current stage's time, K (read only while held). */
  lowK: number;
  highK: number;
  /** Start of the current step, s (time/plates.ts sets it; the stages read the set-point at their own time). */
  t0S: number;
  /**
   * While held: the effective step of the law's power in the current stage, s. The trapezoidal stage takes its power
   * wholly at the stage's end (2·d·h, backward Euler for that term), the others d·h: a law that falls from full power
   * to none across a tenth of the band is far stiffer than the plate, and the trapezoidal rule's explicit half at full
   * power overshot it (a hold begun with a 0.046 s step put a plate 91 K above its band).
   */
  heldHd: number;
}

export function createPlateNode(tK: number): PlateNode {
  return { tK, b: tK, hd: 0, powerWPerM2: 0, held: false, lowK: NaN, highK: NaN, t0S: 0, heldHd: 0 };
}

/** The set-point at time tS, K: linear between points, held outside them. */
export function setPointAt(points: readonly SetPoint[], tS: number): number {
  const first = points[0];
  if (first === undefined) return NaN;
  if (tS <= first.atS) return first.tK;
  for (let i = 1; i < points.length; i++) {
    const p = points[i]!;
    if (tS <= p.atS) {
      const q = points[i - 1]!;
      return q.tK + ((p.tK - q.tK) * (tS - q.atS)) / (p.atS - q.atS);
    }
  }
  return points[points.length - 1]!.tK;
}

/**
 * The cycle of a relay that switches its plate between lowK and highK with the face held at faceK: writes its period
 * (s, +∞ where it stays on or off) to out[0] and the plate's time-mean over it (K) to out[1]. With the face fixed the
 * plate obeys c′·dT/dt = p − (G_c + h_loss)·(T − u), u = (G_c·T_face + h_loss·T_∞)/(G_c + h_loss): off it falls from
 * highK toward u, on it rises from lowK toward u + Δ, Δ = P_max/(G_c + h_loss), both exponentially with τ =
 * c′/(G_c + h_loss) (the lumped node of Incropera et al., §5.3, under a square-wave input), so t_on = τ·ln((u + Δ −
 * lowK)/(u + Δ − highK)) and t_off = τ·ln((highK − u)/(lowK − u)); each segment gives ∫(T − T_asymptote)dt =
 * τ·(T_start − T_finish), so the plate stores nothing over a cycle and its mean is u + Δ·t_on/(t_on + t_off): the middle
 * of a narrow band, leaning toward the slower ramp in a wide one. Where u + Δ ≤ highK full power cannot lift the plate
 * to the set-point (the relay stays on, the plate settles at u + Δ); where u ≥ lowK no power lets it cool to the foot
 * (it stays off at u). The face is massless and moves with the plate within a cycle, so these are estimates: they
 * decide when a hold begins and lets go (time/plates.ts), not the hold itself.
 */
export function relayCycle(h: Heater, lowK: number, highK: number, faceK: number, out: Float64Array): void {
  const gl = h.contactWPerM2K + h.lossWPerM2K;
  const u = (h.contactWPerM2K * faceK + h.lossWPerM2K * h.lossToK) / gl;
  const delta = h.powerWPerM2 / gl;
  const up = u + delta - highK;
  const down = lowK - u;
  out[0] = Infinity;
  if (!(up > 0)) { out[1] = u + delta; return; }
  if (!(down > 0)) { out[1] = u; return; }
  const band = highK - lowK;
  // log1p: for a narrow band each ratio is 1 + band/(distance), which ln() of the ratio would round away
  const on = Math.log1p(band / up);
  const off = Math.log1p(band / down);
  out[0] = (h.capacityJPerM2K / gl) * (on + off);
  out[1] = u + (delta * on) / (on + off);
}

/**
 * The plate temperature that solves the current stage for a face at faceK, K; writes dT_p/dT_face to out[0].
 * With the power fixed over the step the stage is linear in T_p (the header). Held in its band, the power follows the
 * held law: P_max below the middle of the node's levels − w/2, none above the middle + w/2, linear between, w =
 * heldWidthShare × band, so that the plate sits within w/2 of the middle of the band, where the switching plate's
 * sawtooth has its mean, drawing the power that holds it there. Then the stage
 * c′·(T_p − b) = d·h·(p(T_p) + G_c·(T_face − T_p) − h_loss·(T_p − T_∞)) is piecewise linear, its left side rising and its
 * right side falling with T_p: one root, on the piece whose own solution lies on it (full power, none, or the slope
 * between).
 */
export function plateStage(h: Heater, node: PlateNode, faceK: number, out: Float64Array): number {
  const c = h.capacityJPerM2K;
  const d = node.hd;
  const g = h.contactWPerM2K;
  const open = c + d * (g + h.lossWPerM2K);
  if (!node.held) {
    out[0] = (d * g) / open;
    return (c * node.b + d * (node.powerWPerM2 + g * faceK + h.lossWPerM2K * h.lossToK)) / open;
  }
  const known = c * node.b + d * (g * faceK + h.lossWPerM2K * h.lossToK);
  out[0] = (d * g) / open;
  const half = 0.5 * heldThermostatDefaults.heldWidthShare * (node.highK - node.lowK);
  const none = 0.5 * (node.lowK + node.highK) + half;
  // the law's power enters with its own effective step (PlateNode.heldHd)
  const dp = node.heldHd;
  const atFull = (known + dp * h.powerWPerM2) / open;
  if (atFull <= none - 2 * half) return atFull;
  const atNone = known / open;
  if (atNone >= none) return atNone;
  const slope = h.powerWPerM2 / (2 * half);
  out[0] = (d * g) / (open + dp * slope);
  return (known + dp * slope * none) / (open + dp * slope);
}

/** Heat into the face from the plate in the current stage, W/m²; writes dq/dT_face to out[0]. Allocates nothing. */
export function plateHeatIn(h: Heater, node: PlateNode, faceK: number, out: Float64Array): number {
  const g = h.contactWPerM2K;
  const plateK = plateStage(h, node, faceK, out);
  out[0] = g * (out[0]! - 1);
  return g * (plateK - faceK);
}

/** The plate's net heat rate per footprint area, W/m², at the power powerWPerM2, given the heat q it passes into the face. */
export function plateRate(h: Heater, powerWPerM2: number, plateK: number, faceQ: number): number {
  return powerWPerM2 - faceQ - h.lossWPerM2K * (plateK - h.lossToK);
}
