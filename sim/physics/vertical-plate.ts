/**
 * Natural convection from a vertical plate of height L to quiescent air: the side wall of a cell stack.
 * Churchill & Chu (1975), "Correlating equations for laminar and turbulent free convection from a vertical plate",
 * Int. J. Heat Mass Transfer 18, 1323–1329; as Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, eq. 9.26:
 *   Nu_L = { 0.825 + 0.387·Ra_L^(1/6) / [1 + (0.492/Pr)^(9/16)]^(8/27) }²,   Ra_L = g·β·|T − T∞|·L³/(ν·α),
 * properties at the film temperature, β = 1/T_film (ideal gas). Incropera states it "may be applied over the entire
 * range of Ra_L"; the paper's data span about 10⁻¹ < Ra_L < 10¹² (from memory). A cell a few millimetres tall sits at
 * Ra_L ~ 1–10³, inside that span. At Ra_L → 0 it tends to Nu = 0.825² ≈ 0.68, a conduction-like floor, so h does not
 * vanish as T → T∞ and q(T) is smooth there (no kink for Newton).
 */
import { airConductivity, airDiffusivity, airKinematicViscosity, airPropertiesAt } from './air.ts';
import { filmTemperature } from './natural-convection.ts';
import { evalTable } from './table.ts';
import { STANDARD_GRAVITY_M_S2 } from './units.ts';

/** The Rayleigh span of the data Churchill & Chu correlated (from memory); outside it the formula is extrapolated. */
export const verticalPlateRange = { low: 1e-1, high: 1e12 } as const;

/** The constants of Churchill & Chu's all-range equation (Incropera eq. 9.26). */
const CC = { floor: 0.825, lead: 0.387, prRef: 0.492, prPower: 9 / 16, outerPower: 8 / 27 } as const;

/** Churchill–Chu Nusselt number Nu_L of a vertical plate at Rayleigh number ra (≥ 0) and Prandtl number pr. */
export function churchillChuNusselt(ra: number, pr: number): number {
  const x = CC.floor + (CC.lead * Math.cbrt(Math.sqrt(ra))) / (1 + (CC.prRef / pr) ** CC.prPower) ** CC.outerPower;
  return x * x;
}

/** Rayleigh number Ra_L of a vertical plate of height heightM at tK in air at fluidK (air.ts properties). */
export function verticalPlateRayleigh(tK: number, fluidK: number, heightM: number): number {
  const film = filmTemperature(tK, fluidK);
  const nu = evalTable(airKinematicViscosity, film);
  const alpha = evalTable(airDiffusivity, film);
  return (STANDARD_GRAVITY_M_S2 * Math.abs(tK - fluidK) * heightM ** 3) / (film * nu * alpha);
}

const io = new Float64Array(6);

/**
 * Heat lost by convection from a vertical plate at tK to air at fluidK, W/m² (positive when the plate is hotter),
 * with dq/dT (W·m⁻²·K⁻¹) in out[0]. q = h·(T − T∞), h = Nu_L·k(T_f)/L, so
 *   dq/dT = h + h·e·[1 − (T − T∞)·½(1/T_f + ν'/ν + α'/α)] + h·(T − T∞)·½·k'/k,   e = d ln Nu/d ln Ra,
 * written without 1/(T − T∞), so it holds at T = T∞ (where e = 0). Pr is held in the slope (it moves by a few per
 * cent over the air table). Overwrites out[0]; allocates nothing.
 */
export function verticalPlateLoss(tK: number, fluidK: number, heightM: number, out: Float64Array): number {
  io[0] = tK;
  io[1] = fluidK;
  io[2] = heightM;
  verticalPlateAt(io);
  out[0] = io[1]!;
  return io[0]!;
}

/**
 * verticalPlateLoss() for the solver's hot path, with its numbers passed through `io` (a double passed to or returned
 * from a call the JIT does not inline is allocated on the heap): reads T = io[0], T∞ = io[1] (K) and L = io[2] (m),
 * writes q = io[0] (W/m²) and dq/dT = io[1] (W·m⁻²·K⁻¹). io needs 6 entries. Allocates nothing.
 */
export function verticalPlateAt(io: Float64Array): void {
  const tK = io[0]!;
  const fluidK = io[1]!;
  const heightM = io[2]!;
  const film = 0.5 * (tK + fluidK); // filmTemperature()
  io[0] = film;
  airPropertiesAt(io);
  const k = io[0]!;
  const dK = io[1]!;
  const nuAir = io[2]!;
  const dNuAir = io[3]!;
  const alpha = io[4]!;
  const dAlpha = io[5]!;
  const dT = tK - fluidK;
  const ra = (STANDARD_GRAVITY_M_S2 * Math.abs(dT) * heightM ** 3) / (film * nuAir * alpha);
  const rising = (CC.lead * Math.cbrt(Math.sqrt(ra))) / (1 + (CC.prRef / (nuAir / alpha)) ** CC.prPower) ** CC.outerPower;
  const x = CC.floor + rising;
  const h = (x * x * k) / heightM;
  // Nu = x², x = 0.825 + c·Ra^(1/6): d ln Nu/d ln Ra = 2·(rising/6)/x
  const e = rising / (3 * x);
  io[1] = h + h * e * (1 - dT * 0.5 * (1 / film + dNuAir / nuAir + dAlpha / alpha)) + h * dT * 0.5 * (dK / k);
  io[0] = h * dT;
}

/** Heat-transfer coefficient h, W·m⁻²·K⁻¹, of a vertical plate of height heightM at tK in air at fluidK. */
export function verticalPlateCoefficient(tK: number, fluidK: number, heightM: number): number {
  const film = filmTemperature(tK, fluidK);
  const pr = evalTable(airKinematicViscosity, film) / evalTable(airDiffusivity, film);
  return (churchillChuNusselt(verticalPlateRayleigh(tK, fluidK, heightM), pr) * evalTable(airConductivity, film)) / heightM;
}
