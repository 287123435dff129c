import { toMm } from '../units.ts';

/**
 * STL reading, binary and ASCII, into a flat triangle list in millimetres.
 *
 * Written here rather than taken from npm: the maintained STL readers either depend on three.js (not allowed
 * in the core), on Node's Buffer/fs, or guess binary vs ASCII from the word "solid" alone, which many binary
 * exporters also write into their 80-byte header. STL is small enough to read exactly:
 * binary = 80-byte header, uint32 triangle count n, then n × 50 bytes (normal, three corners as float32
 * little-endian, 2 attribute bytes), so a binary file is exactly 84 + 50·n bytes long; ASCII =
 * "solid name / facet normal … / outer loop / vertex x y z ×3 / endloop / endfacet / endsolid".
 * STL carries no unit, so the caller names it. Facet normals are ignored: the corner order is the standard's
 * statement of which side is outside, and it is what the divergence theorem uses.
 */

/** Length units an STL file may have been written in. */
export type StlLengthUnit = 'mm' | 'cm' | 'm' | 'in';

export interface ParsedStl {
  /** 9 numbers per triangle (three corners x, y, z), mm, in file order. */
  trianglesMm: Float64Array;
  triangleCount: number;
  format: 'binary' | 'ascii';
  /** The name after "solid" (ASCII), or the header text (binary) when printable; null when none. */
  solidName: string | null;
}

export interface ParseStlOptions {
  /** Names the file in error messages. Default "STL file". */
  fileName?: string;
}

const STL_UNITS: readonly StlLengthUnit[] = ['mm', 'cm', 'm', 'in'];

function toBytes(data: Uint8Array | ArrayBuffer): Uint8Array {
  return data instanceof Uint8Array ? data : new Uint8Array(data);
}

/** True when the bytes, after optional white space or a byte-order mark, begin with "solid". */
function startsWithSolid(bytes: Uint8Array): boolean {
  let i = 0;
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) i = 3;
  while (i < bytes.length && (bytes[i] === 0x20 || bytes[i] === 0x09 || bytes[i] === 0x0a || bytes[i] === 0x0d)) i++;
  const word = String.fromCharCode(...bytes.subarray(i, i + 5)).toLowerCase();
  return word === 'solid';
}

/**
 * Reads an STL file (binary or ASCII) and returns its triangles in millimetres.
 * Binary is recognised by its exact size (84 + 50·n bytes), even when its header begins with "solid".
 * @throws naming the file and the problem: too short, truncated or padded binary, a bad ASCII line (with its
 *   line number), a non-finite coordinate (with its triangle), or no triangles at all.
 */
export function parseStl(data: Uint8Array | ArrayBuffer, unit: StlLengthUnit, options: ParseStlOptions = {}): ParsedStl {
  const file = options.fileName ?? 'STL file';
  if (!STL_UNITS.includes(unit)) throw new Error(`${file}: length unit must be one of ${STL_UNITS.join(', ')} (got ${String(unit)}).`);
  const bytes = toBytes(data);
  const scale = toMm(1, unit);
  const looksAscii = startsWithSolid(bytes);

  let binaryProblem = '';
  if (bytes.length >= 84) {
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    const n = view.getUint32(80, true);
    const expected = 84 + 50 * n;
    if (bytes.length === expected) return parseBinary(bytes, view, n, scale, file);
    binaryProblem =
      `its header says ${n} triangles, which needs exactly ${expected} bytes, but the file has ${bytes.length} bytes ` +
      `(${bytes.length < expected ? 'truncated' : 'extra data after the last triangle'})`;
    if (!looksAscii) {
      throw new Error(`${file}: not a valid binary STL: ${binaryProblem}; and it does not begin with "solid", so it is not ASCII STL either.`);
    }
  } else if (!looksAscii) {
    throw new Error(`${file}: not an STL file: ${bytes.length} bytes is shorter than the 84-byte binary header, and it does not begin with "solid".`);
  }
  try {
    return parseAscii(bytes, scale, file);
  } catch (e) {
    // Binary exporters often start the header with "solid": say why it is not binary either.
    if (binaryProblem && e instanceof Error) throw new Error(`${e.message} Read as binary STL instead, ${binaryProblem}.`, { cause: e });
    throw e;
  }
}

function parseBinary(bytes: Uint8Array, view: DataView, n: number, scale: number, file: string): ParsedStl {
  if (n === 0) throw new Error(`${file}: binary STL with no triangles.`);
  const out = new Float64Array(n * 9);
  for (let i = 0; i < n; i++) {
    const off = 84 + 50 * i + 12; // skip the facet normal
    for (let j = 0; j < 9; j++) {
      const v = view.getFloat32(off + 4 * j, true);
      if (!Number.isFinite(v)) {
        throw new Error(`${file}: triangle ${i + 1} (of ${n}), corner ${Math.floor(j / 3) + 1}: coordinate ${'xyz'[j % 3]} is not a finite number (${v}).`);
      }
      out[i * 9 + j] = v * scale;
    }
  }
  // The header is free text; show it as a name only when it is printable.
  const header = String.fromCharCode(...bytes.subarray(0, 80)).replace(/\0.*$/s, '').trim();
  const printable = /^[\x20-\x7e]*$/.test(header) && header.length > 0;
  return { trianglesMm: out, triangleCount: n, format: 'binary', solidName: printable ? header : null };
}

function parseAscii(bytes: Uint8Array, scale: number, file: string): ParsedStl {
  const text = new TextDecoder('utf-8').decode(bytes);
  const len = text.length;
  let pos = 0;
  const lineAt = (p: number): number => {
    let line = 1;
    for (let i = 0; i < p && i < len; i++) if (text.charCodeAt(i) === 10) line++;
    return line;
  };
  const fail = (p: number, msg: string): never => {
    throw new Error(`${file}: not valid ASCII STL at line ${lineAt(p)}: ${msg}`);
  };
  const isSpace = (c: number): boolean => c === 32 || c === 9 || c === 10 || c === 13 || c === 12 || c === 0xfeff;
  let tokStart = 0;
  const next = (): string | null => {
    while (pos < len && isSpace(text.charCodeAt(pos))) pos++;
    if (pos >= len) return null;
    tokStart = pos;
    while (pos < len && !isSpace(text.charCodeAt(pos))) pos++;
    return text.slice(tokStart, pos);
  };
  const restOfLine = (): string => {
    const start = pos;
    while (pos < len && text.charCodeAt(pos) !== 10) pos++;
    return text.slice(start, pos).trim();
  };
  const expect = (word: string): void => {
    const t = next();
    if (t === null) fail(len, `the file ends where "${word}" was expected (truncated?).`);
    if ((t as string).toLowerCase() !== word) fail(tokStart, `expected "${word}", found "${shorten(t as string)}".`);
  };
  const num = (what: string): number => {
    const t = next();
    if (t === null) fail(len, `the file ends inside a ${what} (truncated?).`);
    const v = Number(t);
    if (!Number.isFinite(v) || !/\d/.test(t as string)) fail(tokStart, `${what} "${shorten(t as string)}" is not a finite number.`);
    return v;
  };

  const coords: number[] = [];
  let solidName: string | null = null;
  let solids = 0;
  for (;;) {
    const t = next();
    if (t === null) break;
    if (t.toLowerCase() !== 'solid') fail(tokStart, `expected "solid", found "${shorten(t)}".`);
    const name = restOfLine();
    if (solids === 0) solidName = name.length > 0 ? name : null;
    solids++;
    for (;;) {
      const w = next();
      if (w === null) fail(len, 'the file ends before "endsolid" (truncated?).');
      const lw = (w as string).toLowerCase();
      if (lw === 'endsolid') {
        restOfLine();
        break;
      }
      if (lw !== 'facet') fail(tokStart, `expected "facet" or "endsolid", found "${shorten(w as string)}".`);
      expect('normal');
      num('normal component');
      num('normal component');
      num('normal component');
      expect('outer');
      expect('loop');
      for (let c = 0; c < 3; c++) {
        const v = next();
        if (v === null) fail(len, 'the file ends inside a facet (truncated?).');
        if ((v as string).toLowerCase() !== 'vertex') {
          fail(tokStart, `expected "vertex" (a facet has exactly three), found "${shorten(v as string)}".`);
        }
        coords.push(num('vertex coordinate') * scale, num('vertex coordinate') * scale, num('vertex coordinate') * scale);
      }
      const e = next();
      if (e === null) fail(len, 'the file ends inside a facet (truncated?).');
      if ((e as string).toLowerCase() !== 'endloop') {
        fail(tokStart, `expected "endloop" after three vertices (a facet has exactly three), found "${shorten(e as string)}".`);
      }
      expect('endfacet');
    }
  }
  if (solids === 0) throw new Error(`${file}: not an STL file: empty.`);
  if (coords.length === 0) throw new Error(`${file}: ASCII STL with no triangles.`);
  return { trianglesMm: Float64Array.from(coords), triangleCount: coords.length / 9, format: 'ascii', solidName };
}

function shorten(s: string): string {
  const printable = s.replace(/[^\x20-\x7e]/g, '?');
  return printable.length > 24 ? `${printable.slice(0, 24)}…` : printable;
}
