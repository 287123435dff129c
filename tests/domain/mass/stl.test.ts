import { describe, expect, it } from 'vitest';
import * as THREE from 'three';
import { STLExporter } from 'three/addons/exporters/STLExporter.js';
import { STLLoader } from 'three/addons/loaders/STLLoader.js';
import { meshMassProperties, parseStl } from '../../../src/domain/mass/index.ts';
import { cuboid } from './mesh-builders.ts';

/**
 * STL reading checked against three.js's STLExporter and STLLoader (an independent, widely used
 * implementation of the format; allowed in tests, never in the core).
 */

/** A binary STL written by hand from the format's layout: 80-byte header, uint32 n, n × 50 bytes. */
function binaryStl(tris: number[], header = 'Ballast test part'): Uint8Array {
  const n = tris.length / 9;
  const buf = new ArrayBuffer(84 + 50 * n);
  const view = new DataView(buf);
  for (let i = 0; i < Math.min(80, header.length); i++) view.setUint8(i, header.charCodeAt(i));
  view.setUint32(80, n, true);
  for (let t = 0; t < n; t++) for (let j = 0; j < 9; j++) view.setFloat32(84 + 50 * t + 12 + 4 * j, tris[9 * t + j], true);
  return new Uint8Array(buf);
}

function asciiStl(tris: number[], name = 'part'): string {
  let s = `solid ${name}\n`;
  for (let t = 0; t < tris.length; t += 9) {
    s += '  facet normal 0 0 0\n    outer loop\n';
    for (let c = 0; c < 3; c++) s += `      vertex ${tris[t + 3 * c]} ${tris[t + 3 * c + 1]} ${tris[t + 3 * c + 2]}\n`;
    s += '    endloop\n  endfacet\n';
  }
  return `${s}endsolid ${name}\n`;
}

const enc = new TextEncoder();

describe('parseStl against three.js STLExporter / STLLoader', () => {
  const mesh = new THREE.Mesh(new THREE.SphereGeometry(50, 32, 16));
  mesh.position.set(100, 0, 0);
  mesh.updateMatrixWorld();
  const exporter = new STLExporter();

  it('reads the binary export triangle for triangle as STLLoader does', () => {
    const dv = exporter.parse(mesh, { binary: true }) as DataView;
    const bytes = new Uint8Array(dv.buffer, dv.byteOffset, dv.byteLength);
    const ours = parseStl(bytes, 'mm', { fileName: 'sphere.stl' });
    const ref = new STLLoader().parse(dv.buffer.slice(dv.byteOffset, dv.byteOffset + dv.byteLength) as ArrayBuffer);
    const pos = ref.getAttribute('position').array as Float32Array;
    expect(ours.format).toBe('binary');
    expect(ours.triangleCount).toBe(pos.length / 9);
    for (let i = 0; i < pos.length; i++) expect(ours.trianglesMm[i]).toBe(pos[i]);
  });

  it('reads the ASCII export to the printed precision, and both give the same volume (a closed sphere, poles included)', () => {
    const text = exporter.parse(mesh) as string;
    const ours = parseStl(enc.encode(text), 'mm');
    const ref = new STLLoader().parse(text);
    const pos = ref.getAttribute('position').array as Float32Array;
    expect(ours.format).toBe('ascii');
    expect(ours.solidName).toBe('exported');
    expect(ours.triangleCount).toBe(pos.length / 9);
    for (let i = 0; i < pos.length; i++) expect(Math.abs(ours.trianglesMm[i] - pos[i])).toBeLessThan(1e-4);
    // three's sphere repeats its seam vertices as separate corners: closed once equal corners are welded.
    const m = meshMassProperties(ours.trianglesMm, 1000);
    expect(m.vertexCount).toBeLessThan(ours.triangleCount);
    expect(m.volumeMm3).toBeGreaterThan(0.98 * (4 / 3) * Math.PI * 50 ** 3);
    expect(m.cogMm[0]).toBeCloseTo(100, 6);
  });
});

describe('parseStl: format detection, units and errors', () => {
  const box = cuboid(1, 2, 3, [0.5, 0, 0]);

  it('detects binary by size even when the header starts with "solid"', () => {
    const b = binaryStl(box, 'solid part exported by a CAD tool');
    const r = parseStl(b, 'mm');
    expect(r.format).toBe('binary');
    expect(r.triangleCount).toBe(12);
    expect(r.solidName).toBe('solid part exported by a CAD tool');
  });

  it('converts the caller\'s length unit to mm (STL has none): in, cm, m [PUB: 1 in = 25.4 mm exactly]', () => {
    const ascii = enc.encode(asciiStl(box));
    expect(parseStl(ascii, 'in').trianglesMm[6]).toBeCloseTo(1.5 * 25.4, 12); // third corner x = 1.5 in
    expect(parseStl(binaryStl(box), 'cm').trianglesMm[6]).toBeCloseTo(15, 12);
    const m = meshMassProperties(parseStl(binaryStl(box), 'm').trianglesMm, 1000);
    expect(m.massKg).toBeCloseTo(6000, 6); // 1 × 2 × 3 m of water-like density: 6 t
  });

  it('reads ASCII with upper-case keywords, CRLF line ends, a byte-order mark and several solids', () => {
    const two = asciiStl(box, 'a') + asciiStl(cuboid(1, 1, 1, [5, 5, 5]), 'b');
    const text = '\ufeff' + two.replace(/facet normal/g, 'FACET NORMAL').replace(/\n/g, '\r\n');
    const r = parseStl(enc.encode(text), 'mm');
    expect(r.triangleCount).toBe(24);
    expect(r.solidName).toBe('a');
  });

  it('takes an ArrayBuffer and a Uint8Array view into a larger buffer', () => {
    const b = binaryStl(box);
    const big = new Uint8Array(b.length + 16);
    big.set(b, 8);
    expect(parseStl(big.subarray(8, 8 + b.length), 'mm').triangleCount).toBe(12);
    expect(parseStl(b.buffer as ArrayBuffer, 'mm').triangleCount).toBe(12);
  });

  it('refuses a truncated binary file, naming the expected and actual sizes', () => {
    const b = binaryStl(box);
    expect(() => parseStl(b.subarray(0, b.length - 7), 'mm', { fileName: 'arm.stl' })).toThrow(
      /arm\.stl: not a valid binary STL: its header says 12 triangles, which needs exactly 684 bytes, but the file has 677 bytes \(truncated\)/,
    );
  });

  it('refuses a binary file with a "solid" header and the wrong size, saying why it is neither', () => {
    const b = binaryStl(box, 'solid x');
    expect(() => parseStl(b.subarray(0, 600), 'mm')).toThrow(/not valid ASCII STL at line 1.*Read as binary STL instead, its header says 12 triangles/s);
  });

  it('refuses truncated ASCII, a four-corner facet and a non-numeric coordinate with the line number', () => {
    const text = asciiStl(box);
    expect(() => parseStl(enc.encode(text.slice(0, 200)), 'mm')).toThrow(/not valid ASCII STL at line \d+: .*(truncated|expected)/);
    const four = text.replace('    endloop', '      vertex 0 0 0\n    endloop');
    expect(() => parseStl(enc.encode(four), 'mm')).toThrow(/line 7: expected "endloop" after three vertices/);
    const bad = text.replace('vertex 0.5 0 0', 'vertex 0.5 abc 0');
    expect(() => parseStl(enc.encode(bad), 'mm')).toThrow(/line 4: vertex coordinate "abc" is not a finite number/);
  });

  it('refuses files that are not STL at all, empty solids, NaN in binary and unknown units', () => {
    expect(() => parseStl(enc.encode('hello'), 'mm')).toThrow(/not an STL file: 5 bytes/);
    expect(() => parseStl(new Uint8Array(200), 'mm')).toThrow(/header says 0 triangles/);
    expect(() => parseStl(enc.encode('solid empty\nendsolid empty\n'), 'mm')).toThrow(/ASCII STL with no triangles/);
    const b = binaryStl(box);
    new DataView(b.buffer).setFloat32(84 + 50 * 2 + 12 + 4, NaN, true);
    expect(() => parseStl(b, 'mm', { fileName: 'p.stl' })).toThrow(/p\.stl: triangle 3 \(of 12\), corner 1: coordinate y is not a finite number/);
    expect(() => parseStl(binaryStl(box), 'ft' as 'mm')).toThrow(/length unit must be one of mm, cm, m, in/);
  });
});
