/**
 * Units at the edge. Inside sim/ every quantity is SI (m, s, K, W, J, kg); the scenario file and the printed output
 * use mm and °C. These are the only conversions, applied once when a scenario is read and once when a result is written.
 */

/** 0 °C in kelvin (exact, by definition of the Celsius scale; SI Brochure, 9th ed., §2.3.1). */
export const ZERO_CELSIUS_K = 273.15;

/** Stefan–Boltzmann constant, W·m⁻²·K⁻⁴ (CODATA 2018, exact since the 2019 SI redefinition). */
export const STEFAN_BOLTZMANN_W_M2K4 = 5.670374419e-8;

/** Standard acceleration of gravity, m·s⁻² (exact, CGPM 1901). */
export const STANDARD_GRAVITY_M_S2 = 9.80665;

export const METRES_PER_MM = 1e-3;

export const cToK = (celsius: number): number => celsius + ZERO_CELSIUS_K;
export const kToC = (kelvin: number): number => kelvin - ZERO_CELSIUS_K;
export const mmToM = (mm: number): number => mm * METRES_PER_MM;
export const mToMm = (m: number): number => m / METRES_PER_MM;
