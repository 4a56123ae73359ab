/**
 * Where the bottom heating ends: the first bottom row that follows a heating row (a held plate, a held face, or a
 * positive flux or heater power) and is not one itself. Its `from_s` is "heat off at …".
 */
import { asList, asNumber, isObject, type Json } from './json.ts';

export function isHeatingRow(row: Json | undefined): boolean {
  if (!isObject(row)) return false;
  if (row.plate !== undefined || row.fixed_C !== undefined) return true;
  return (asNumber(row.flux_W_m2) ?? 0) > 0 || (asNumber(row.power_W) ?? 0) > 0;
}

/** Index of the bottom row where the heating ends, or undefined if it never does. */
export function heaterOffRow(bottom: Json | undefined): number | undefined {
  const rows = asList(bottom);
  for (let j = 1; j < rows.length; j++) {
    if (isHeatingRow(rows[j - 1]) && !isHeatingRow(rows[j])) return j;
  }
  return undefined;
}
