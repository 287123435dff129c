import { randomUUID } from 'node:crypto';
import { z, type ZodType } from 'zod';

/**
 * Builds a body that a route's zod schema accepts, from the schema alone, so that the hostile-input suite can
 * start from a valid request for any route, including routes added after it was written. The schema is read
 * through zod's JSON Schema export (input side); refinements JSON Schema cannot express are met by trying
 * common candidate values on the fields zod names in its issues.
 */

type Js = {
  type?: string | string[];
  properties?: Record<string, Js>;
  required?: string[];
  items?: Js | Js[];
  prefixItems?: Js[];
  minItems?: number;
  enum?: unknown[];
  const?: unknown;
  default?: unknown;
  anyOf?: Js[];
  oneOf?: Js[];
  allOf?: Js[];
  format?: string;
  pattern?: string;
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  additionalProperties?: boolean | Js;
};

/** Gives a real id for a body field such as `sectionId` (undefined: a fresh uuid is used). */
export type IdResolver = (fieldName: string) => string | undefined;

export interface SampleContext {
  resolveId: IdResolver;
  /** The current `version` of the row the route edits, for versioned saves. */
  version?: number;
  /** Makes unique values (codes, e-mail addresses). */
  unique: () => string;
}

export function jsonSchemaOf(schema: ZodType): Js | undefined {
  try {
    return z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' }) as Js;
  } catch {
    return undefined;
  }
}

/** Object properties of a schema (top level), with whether each is a plain string that takes free text. */
export function topLevelFields(js: Js | undefined): { name: string; schema: Js; required: boolean; freeText: boolean }[] {
  const obj = js && (js.type === 'object' ? js : js.allOf?.find((s) => s.type === 'object'));
  if (!obj?.properties) return [];
  return Object.entries(obj.properties).map(([name, s]) => {
    const plain = unwrapNullable(s);
    return { name, schema: s, required: obj.required?.includes(name) ?? false, freeText: plain.type === 'string' && !plain.format && !plain.pattern && !plain.enum && plain.const === undefined };
  });
}

function unwrapNullable(s: Js): Js {
  const opts = s.anyOf ?? s.oneOf;
  if (opts) return opts.find((o) => o.type !== 'null') ?? s;
  return s;
}

export function sampleFromJs(js: Js, name: string, ctx: SampleContext, depth = 0): unknown {
  if (depth > 8) return undefined;
  if (js.const !== undefined) return js.const;
  if (js.enum?.length) return js.enum[0];
  if (js.default !== undefined) return js.default;
  const opts = js.anyOf ?? js.oneOf;
  if (opts?.length) return sampleFromJs(opts.find((o) => o.type !== 'null') ?? opts[0], name, ctx, depth + 1);
  if (js.allOf?.length) return sampleFromJs(js.allOf[0], name, ctx, depth + 1);
  const type = Array.isArray(js.type) ? js.type.find((t) => t !== 'null') : js.type;
  switch (type) {
    case 'object': {
      const out: Record<string, unknown> = {};
      for (const key of js.required ?? []) {
        const prop = js.properties?.[key];
        if (prop) out[key] = sampleFromJs(prop, key, ctx, depth + 1);
      }
      return out;
    }
    case 'array': {
      if (js.prefixItems) return js.prefixItems.map((s, i) => sampleFromJs(s, `${name}.${i}`, ctx, depth + 1));
      const n = js.minItems ?? 0;
      const item = Array.isArray(js.items) ? js.items[0] : js.items;
      return Array.from({ length: n }, (_, i) => (item ? sampleFromJs(item, `${name}.${i}`, ctx, depth + 1) : null));
    }
    case 'string':
      return sampleString(js, name, ctx);
    case 'integer':
    case 'number': {
      if (/^version$/i.test(name) && ctx.version !== undefined) return ctx.version;
      let v = 1;
      if (js.minimum !== undefined) v = Math.max(v, js.minimum);
      if (js.exclusiveMinimum !== undefined) v = Math.max(v, js.exclusiveMinimum + 1);
      if (js.maximum !== undefined) v = Math.min(v, js.maximum);
      if (js.exclusiveMaximum !== undefined && v >= js.exclusiveMaximum) v = type === 'integer' ? js.exclusiveMaximum - 1 : js.exclusiveMaximum / 2;
      return v;
    }
    case 'boolean':
      return false;
    case 'null':
      return null;
    default:
      return 'sample';
  }
}

function sampleString(js: Js, name: string, ctx: SampleContext): string {
  if (js.format === 'uuid' || /Id$/.test(name)) return ctx.resolveId(name.split('.')[0]) ?? randomUUID();
  if (js.format === 'email' || /e-?mail/i.test(name)) return `hostile-${ctx.unique()}@example.com`;
  if (js.format === 'date-time') return '2027-03-01T10:00:00.000Z';
  if (js.format === 'date') return '2027-03-01';
  if (js.format === 'uri' || js.format === 'url') return 'https://example.com/';
  if (js.pattern) {
    const re = new RegExp(js.pattern);
    const found = CANDIDATE_STRINGS.find((c) => re.test(c));
    if (found) return found;
  }
  let s = /code|number|name|title|label/i.test(name) ? `S${ctx.unique()}` : 'Sample text';
  if (js.maxLength !== undefined && s.length > js.maxLength) s = s.slice(0, js.maxLength);
  if (js.minLength !== undefined && s.length < js.minLength) s = s.padEnd(js.minLength, 'x');
  return s;
}

const CANDIDATE_STRINGS = ['EUR', 'NL', 'A', 'a1', '2027-03-01', '2027-03-01T10:00:00.000Z', '10:00', '#336699', 'x', 'Sample', '1', 'AB12'];

/**
 * A body the schema accepts, or undefined when none was found. Starts from the JSON Schema sample, then fixes
 * the fields zod complains about with candidate values.
 */
export function validSample(schema: ZodType, ctx: SampleContext): Record<string, unknown> | undefined {
  const js = jsonSchemaOf(schema);
  if (!js) return undefined;
  const body = sampleFromJs(js, '', ctx);
  if (body === null || typeof body !== 'object' || Array.isArray(body)) return undefined;
  for (let attempt = 0; attempt < 6; attempt++) {
    const parsed = schema.safeParse(body);
    if (parsed.success) return body as Record<string, unknown>;
    let fixed = false;
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String);
      if (!path.length) continue;
      const candidates: unknown[] = [
        ...CANDIDATE_STRINGS,
        `hostile-${ctx.unique()}@example.com`,
        ctx.resolveId(path[0]) ?? randomUUID(),
        0,
        1,
        10,
        true,
        false,
        [],
        null,
      ];
      for (const c of candidates) {
        const trial = structuredClone(body) as Record<string, unknown>;
        setPath(trial, path, c);
        const r = schema.safeParse(trial);
        const stillBad = !r.success && r.error.issues.some((i) => i.path.map(String).join('.') === path.join('.'));
        if (!stillBad) {
          setPath(body as Record<string, unknown>, path, c);
          fixed = true;
          break;
        }
      }
    }
    if (!fixed) return undefined;
  }
  return schema.safeParse(body).success ? (body as Record<string, unknown>) : undefined;
}

export function setPath(obj: Record<string, unknown>, path: string[], value: unknown): void {
  let cur: Record<string, unknown> = obj;
  for (let i = 0; i < path.length - 1; i++) {
    const next = cur[path[i]];
    if (next === null || typeof next !== 'object') cur[path[i]] = /^\d+$/.test(path[i + 1]) ? [] : {};
    cur = cur[path[i]] as Record<string, unknown>;
  }
  cur[path[path.length - 1]] = value;
}

/** Paths of every string value in a body (for putting hostile text in each). */
export function stringPaths(value: unknown, prefix: string[] = []): string[][] {
  if (typeof value === 'string') return [prefix];
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => stringPaths(v, [...prefix, k]));
}

/** A value of a clearly wrong type for a JSON Schema node. */
export function wrongTypeFor(js: Js): unknown {
  const plain = unwrapNullable(js);
  const t = Array.isArray(plain.type) ? plain.type[0] : plain.type;
  if (t === 'string') return { not: 'a string' };
  if (t === 'number' || t === 'integer') return '12 kg';
  if (t === 'boolean') return 'yes';
  if (t === 'array') return { 0: 'not an array' };
  if (t === 'object') return ['not', 'an', 'object'];
  return [[[]]];
}
