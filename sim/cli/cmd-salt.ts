/**
 * `freezeline salt LiCl=0.80 KCl=0.20 [--mass] [--json]`: the melting range of a LiCl–KCl mixture from the liquidus
 * model (sim/physics/salt.ts): solidus, liquidus, and the model's eutectic point. Fractions are mole fractions unless --mass.
 */
import type { Command } from 'commander';
import type { FieldError } from '../scenario/field-errors.ts';
import { liquidusModel, meltingRange, mixtureLatentJPerKg } from '../physics/salt.ts';
import { liclMoleFraction } from '../scenario/salt-mixture.ts';
import { kToC } from '../physics/units.ts';
import { predictionNotCertification } from '../observe/wording.ts';
import { InputError } from './input.ts';

const SALTS = ['LiCl', 'KCl'] as const;

/** `LiCl=0.8 KCl=0.2` → { LiCl, KCl }, or an InputError naming the argument. */
export function parseParts(parts: readonly string[]): { LiCl: number; KCl: number } {
  const found: Partial<Record<(typeof SALTS)[number], number>> = {};
  for (const part of parts) {
    const m = /^([A-Za-z]+)=(.*)$/.exec(part);
    const name = SALTS.find((s) => s.toLowerCase() === m?.[1]?.toLowerCase());
    if (!m || !name) throw new InputError(`salt: each argument is LiCl=<fraction> or KCl=<fraction>, got ${JSON.stringify(part)}`);
    const v = Number(m[2]);
    if (m[2]!.trim() === '' || !Number.isFinite(v) || v < 0 || v > 1) throw new InputError(`salt: ${name} must be a fraction in [0, 1], got ${JSON.stringify(m[2])}`);
    if (found[name] !== undefined) throw new InputError(`salt: ${name} is given twice`);
    found[name] = v;
  }
  // one salt given alone implies the other as the rest
  const licl = found.LiCl ?? (found.KCl !== undefined ? 1 - found.KCl : undefined);
  if (licl === undefined) throw new InputError('salt: give the composition, e.g. LiCl=0.80 KCl=0.20');
  return { LiCl: licl, KCl: found.KCl ?? 1 - licl };
}

/** The answer document of `salt --json`. */
export function saltJson(xLiCl: number): Record<string, number> {
  const r = meltingRange(xLiCl);
  // 0.01 K and 1e-4 in mole fraction: far below the model's error (tens of kelvin along the liquidus), above round-off
  const c = (tK: number) => Math.round(kToC(tK) * 100) / 100;
  return {
    solidus_C: c(r.solidusK),
    liquidus_C: c(r.liquidusK),
    eutectic_C: c(r.eutectic.tK),
    eutectic_x_LiCl: Math.round(r.eutectic.xLiCl * 1e4) / 1e4,
  };
}

export function registerSalt(cli: Command): void {
  cli.command('salt').argument('<parts...>', 'the composition, e.g. LiCl=0.80 KCl=0.20')
    .description('melting range of a LiCl–KCl mixture (regular-solution liquidus fitted to the 352 °C eutectic)')
    .option('--mass', 'the fractions are mass fractions (default: mole fractions)')
    .option('--json', 'write { solidus_C, liquidus_C, eutectic_C, eutectic_x_LiCl } on stdout, nothing else')
    .action((parts: string[], opts: { mass?: boolean; json?: boolean }) => {
      const errors: FieldError[] = [];
      const x = liclMoleFraction({ ...parseParts(parts), basis: opts.mass ? 'mass' : 'mole' }, 'salt', errors);
      if (x === undefined) throw new InputError(errors.map((e) => `${e.path}: ${e.message}`).join('\n'));
      const doc = saltJson(x);
      if (opts.json) { process.stdout.write(`${JSON.stringify(doc)}\n`); return; }
      const model = liquidusModel();
      process.stdout.write([
        `LiCl–KCl at ${(100 * x).toFixed(1)} mol % LiCl`,
        `  solidus     ${doc.solidus_C!.toFixed(1)} °C`,
        `  liquidus    ${doc.liquidus_C!.toFixed(1)} °C`,
        `  latent heat ${(mixtureLatentJPerKg(x) / 1000).toFixed(0)} kJ/kg`,
        `  eutectic    ${doc.eutectic_C!.toFixed(1)} °C at ${(100 * doc.eutectic_x_LiCl!).toFixed(1)} mol % LiCl (interaction parameter ${(model.omegaJPerMol / 1000).toFixed(2)} kJ/mol)`,
        '',
        `  ${predictionNotCertification}`,
        '',
      ].join('\n'));
    });
}
