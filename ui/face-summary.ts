/** A face row in plain words ("plate 450 °C + natural convection + radiation ε 0.4"), shown in the row's heading. */
import { formatNumber } from './format.ts';
import { asNumber, asObject, type Json } from './json.ts';

const num = (v: Json | undefined): string => (asNumber(v) === undefined ? '?' : formatNumber(v, { significant: 4 }));

export function segmentSummary(row: Json | undefined): string {
  const s = asObject(row);
  if (s.fixed_C !== undefined) return `face held at ${num(s.fixed_C)} °C`;
  const parts: string[] = [];
  if (s.plate !== undefined) parts.push(`plate ${num(asObject(s.plate).temperature_C)} °C`);
  if (s.flux_W_m2 !== undefined) parts.push(`flux ${num(s.flux_W_m2)} W/m²`);
  if (s.power_W !== undefined) parts.push(`heater ${num(s.power_W)} W`);
  if (s.convection_W_m2K === 'natural') parts.push('natural convection');
  else if (s.convection_W_m2K !== undefined) parts.push(`convection h ${num(s.convection_W_m2K)} W/(m²·K)`);
  if (s.emissivity !== undefined && s.emissivity !== 0) parts.push(`radiation ε ${num(s.emissivity)}`);
  return parts.length === 0 ? 'insulated (no term)' : parts.join(' + ');
}
