/** A face row in plain words ("plate 450 °C + natural convection + radiation ε 0.4"), shown in the row's heading. */
import { formatNumber } from './format.ts';
import { asList, asNumber, asObject, asString, type Json, type JsonObject } from './json.ts';

const num = (v: Json | undefined): string => (asNumber(v) === undefined ? '?' : formatNumber(v, { significant: 4 }));

/** "heater body 150 W, on-off at 420 °C on the plate" (a schedule: "… 3 set-points"). */
function heaterSummary(heater: JsonObject): string {
  const c = asObject(heater.control);
  const base = heater.power_W === undefined ? 'heater body, power to fill in' : `heater body ${num(heater.power_W)} W`;
  if (c.kind !== 'on-off' && c.kind !== 'pi') return `${base}, constant power`;
  const points = asList(heater.set_points);
  const at = points.length > 0 ? `${points.length} set-point${points.length === 1 ? '' : 's'}` : `${num(c.set_point_C)} °C`;
  const sensor = c.sensor === 'plate' ? 'the plate' : `layer ${asString(c.sensor) ?? '?'}`;
  return `${base}, ${c.kind === 'pi' ? 'PI' : 'on-off'} at ${at} on ${sensor}`;
}

export function segmentSummary(row: Json | undefined): string {
  const s = asObject(row);
  if (s.fixed_C !== undefined) return `face held at ${num(s.fixed_C)} °C`;
  if (s.heater !== undefined) return heaterSummary(asObject(s.heater));
  const parts: string[] = [];
  if (s.plate !== undefined) parts.push(`plate ${num(asObject(s.plate).temperature_C)} °C`);
  if (s.flux_W_m2 !== undefined) parts.push(`flux ${num(s.flux_W_m2)} W/m²`);
  if (s.power_W !== undefined) parts.push(`heater ${num(s.power_W)} W`);
  if (s.convection_W_m2K === 'natural') parts.push('natural convection');
  else if (s.convection_W_m2K !== undefined) parts.push(`convection h ${num(s.convection_W_m2K)} W/(m²·K)`);
  if (s.emissivity !== undefined && s.emissivity !== 0) parts.push(`radiation ε ${num(s.emissivity)}`);
  if (s.bench !== undefined) parts.push(`on a bench of ${asString(asObject(s.bench).material) ?? '?'}`);
  return parts.length === 0 ? 'insulated (no term)' : parts.join(' + ');
}
