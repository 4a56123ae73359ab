/**
 * The bundled material library (materials/*.json), each file checked against the library schema when first used.
 * A broken library file is a programming error (the test suite checks every file), so it throws here.
 */
import { libraryMaterialFiles } from '../../materials/index.ts';
import { clip, formatFieldError, formatZodIssue, nearestWord, quote, type FieldError } from './field-errors.ts';
import type { Material } from '../physics/material.ts';
import { materialFromFile } from './material-file.ts';
import { type LibraryMaterialFile, libraryMaterialSchema } from './scenario-schema.ts';

const cache = new Map<string, Material>();
const checkedFiles = new Map<string, LibraryMaterialFile>();

export const libraryNames = (): string[] => Object.keys(libraryMaterialFiles).sort();

/** The checked file of a library material (checked once), or undefined if there is none by that exact name. */
export function libraryFile(name: string): LibraryMaterialFile | undefined {
  if (!Object.hasOwn(libraryMaterialFiles, name)) return undefined;
  const checked = checkedFiles.get(name);
  if (checked) return checked;
  const parsed = libraryMaterialSchema.safeParse(libraryMaterialFiles[name], { reportInput: true });
  if (!parsed.success) {
    const why = parsed.error.issues.flatMap(formatZodIssue).map(formatFieldError).join('; ');
    throw new Error(`materials/${name}.json is invalid: ${why}`);
  }
  checkedFiles.set(name, parsed.data);
  return parsed.data;
}

/** The library material by exact name, built once. */
export function libraryMaterial(name: string): Material | undefined {
  const hit = cache.get(name);
  if (hit) return hit;
  const file = libraryFile(name);
  if (!file) return undefined;
  const errors: FieldError[] = [];
  const material = materialFromFile(name, file, `materials/${name}.json`, errors);
  if (errors.length > 0) throw new Error(errors.map(formatFieldError).join('; '));
  cache.set(name, material);
  return material;
}

/**
 * Words for a material name found neither in the scenario nor in the library: the nearest known name (a likely typo),
 * then every name the scenario could use.
 */
export function unknownMaterialMessage(name: string, ownNames: readonly string[]): string {
  const library = libraryNames();
  const hint = nearestWord(name, [...ownNames, ...library]);
  const listed = ownNames.length > 20 ? `${ownNames.slice(0, 20).map((n) => clip(n)).join(', ')}, … (${ownNames.length} in all)` : ownNames.map((n) => clip(n)).join(', ');
  const own = ownNames.length > 0 ? `this file's materials: ${listed}; ` : '';
  return `unknown material${hint ? ` (did you mean "${hint}"?)` : ''}; ${own}the library's: ${library.join(', ')}; got ${quote(name)}`;
}
