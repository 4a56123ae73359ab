/**
 * The scenario being edited is plain JSON, exactly as it will be saved: a typed-in "abc" or a negative thickness is
 * kept as written, so the solver can name it beside the field. These readers look at that JSON without trusting it.
 */
export type Json = null | boolean | number | string | Json[] | JsonObject;
export interface JsonObject { [key: string]: Json }

export const isObject = (v: unknown): v is JsonObject => typeof v === 'object' && v !== null && !Array.isArray(v);

/** The value as a list (empty if it is not one). */
export const asList = (v: Json | undefined): Json[] => (Array.isArray(v) ? v : []);

/** The value as an object (a fresh empty one if it is not one). */
export const asObject = (v: Json | undefined): JsonObject => (isObject(v) ? v : {});

export const asString = (v: Json | undefined): string | undefined => (typeof v === 'string' ? v : undefined);

/** A finite number, or undefined. */
export const asNumber = (v: Json | undefined): number | undefined =>
  typeof v === 'number' && Number.isFinite(v) ? v : undefined;

/** A deep copy (the draft is never shared with the worker or a saved snapshot). */
export const cloneJson = <T extends Json>(v: T): T => structuredClone(v);

/** Parses JSON text into an object, or explains why not. */
export function parseJsonObject(text: string): { ok: true; value: JsonObject } | { ok: false; message: string } {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    return { ok: false, message: `is not valid JSON (${(e as Error).message})` };
  }
  if (!isObject(value)) return { ok: false, message: 'must be a JSON object' };
  return { ok: true, value: value as JsonObject };
}
