// The one formatting module: event times to 0.1 s or minutes and seconds from 10 min, margins to whole kelvin, about
// 6 significant figures for CSV and energy, words for a missing value and never "NaN". Expected strings are written
// out by hand from the stated rules (60 s to the minute; rounding half away from zero as a person does it).
import { describe, expect, it } from 'vitest';
import { csvNumber, formatEnergy, formatImbalance, formatMargin, formatNumber, formatSignificant, formatTime, NO_VALUE } from '../../sim/observe/format.ts';

const NOT_NUMBERS = [Number.NaN, Infinity, -Infinity];

describe('sim/format', () => {
  it('formatTime() writes event times to 0.1 s with the unit below 10 minutes', () => {
    expect(formatTime(84.94, 'never')).toBe('84.9 s');
    expect(formatTime(0, 'never')).toBe('0.0 s');
    expect(formatTime(599.94, 'never')).toBe('599.9 s');
  });

  it('formatTime() switches to minutes and seconds from 10 minutes, rounding to the second without a "60"', () => {
    expect(formatTime(599.96, 'never')).toBe('10:00 min:s');
    expect(formatTime(600, 'never')).toBe('10:00 min:s');
    expect(formatTime(959.3, 'never')).toBe('15:59 min:s');
    expect(formatTime(959.6, 'never')).toBe('16:00 min:s');
    expect(formatTime(3600, 'never')).toBe('60:00 min:s');
    expect(formatTime(7322.4, 'never')).toBe('122:02 min:s');
  });

  it('formatTime() writes the caller\'s words for a time that has no value, never a number with a unit', () => {
    expect(formatTime(null, 'never fully molten')).toBe('never fully molten');
  });

  it('formatMargin() rounds to whole kelvin with the unit and writes words for a layer without a limit', () => {
    expect(formatMargin(256.9, 'no limit')).toBe('257 K');
    expect(formatMargin(-0.4, 'no limit')).toBe('0 K');
    expect(formatMargin(-12.6, 'no limit')).toBe('-13 K');
    expect(formatMargin(null, 'no limit on file')).toBe('no limit on file');
  });

  it('csvNumber() keeps about 6 significant figures in plain decimal and writes an empty cell for a non-number', () => {
    expect(csvNumber(427.912345678)).toBe('427.912');
    expect(csvNumber(0.123456789)).toBe('0.123457');
    expect(csvNumber(3600)).toBe('3600');
    expect(csvNumber(1.234567e-9)).toBe('1.23457e-9');
    for (const v of NOT_NUMBERS) expect(csvNumber(v)).toBe('');
  });

  it('formatEnergy() writes kJ/m² at 6 significant figures', () => {
    expect(formatEnergy(13703512.4)).toBe('13703.5 kJ/m²');
    expect(formatEnergy(10612)).toBe('10.612 kJ/m²');
    expect(formatSignificant(2.5e-14)).toBe('2.5e-14');
  });

  it('formatNumber() with fewer significant digits than integer digits still prints a plain decimal', () => {
    // 679 061.7 to 3 digits is 679 000 (rounding by hand), not "6.79e+5"
    expect(formatNumber(679061.7, { significant: 3 })).toBe('679000');
    expect(formatNumber(-1234.5, { significant: 2 })).toBe('-1200');
  });

  it('no formatter ever prints NaN or Infinity', () => {
    for (const v of NOT_NUMBERS) {
      for (const text of [formatNumber(v), formatTime(v, 'w'), formatMargin(v, 'w'), formatSignificant(v), formatEnergy(v)]) {
        expect(text).not.toMatch(/NaN|Infinity/);
        expect(text).toContain(NO_VALUE);
      }
    }
  });
});

describe('formatImbalance()', () => {
  it('writes an imbalance at round-off level as words, and a real one to two figures', () => {
    expect(formatImbalance(6.3e-15)).toBe('below 1e-12 (round-off)');
    expect(formatImbalance(2.345e-6)).toBe('2.3e-6');
    expect(formatImbalance(Number.NaN)).toBe(NO_VALUE);
  });
});
