import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { generateBr, BR_TYPES } from '../../../src/domain/packing/benchmarks/br-generator.ts';
import { generateMpv } from '../../../src/domain/packing/benchmarks/mpv-generator.ts';
import { parseMpv } from '../../../src/domain/packing/benchmarks/mpv-format.ts';
import { parseThpack } from '../../../src/domain/packing/benchmarks/thpack-format.ts';

// Public data sets in /work/shared/data/packing (see its README):
// - br-0-15/BRk.txt: Bischoff & Ratcliff (1995) Omega 23(4):377–390, BR0–15 as distributed with the
//   authors' data of Araya et al. (2017) [PUB]; orlib-thpack/thpack1–9.txt from OR-Library (ESICUP copy) [PUB].
// - mpv-3dbpp/<class>_<n>/<v>.txt: Martello, Pisinger & Vigo (2000) Oper. Res. 48:256–267 instances made
//   with the authors' generator (OR-Datasets copy) [PUB].
const DATA = '/work/shared/data/packing';
const read = (p: string) => readFileSync(`${DATA}/${p}`, 'utf8');

describe('thpack / BR files', () => {
  it('parses BR1 problem 1 as printed in the file', () => {
    const [p1] = parseThpack(read('br-0-15/BR1.txt'));
    expect(p1).toEqual({
      problem: 1,
      seed: 2502505,
      container: [587, 233, 220],
      boxes: [
        { id: 1, dims: [108, 76, 30], vertical: [false, false, true], quantity: 40 },
        { id: 2, dims: [110, 43, 25], vertical: [false, true, true], quantity: 33 },
        { id: 3, dims: [92, 81, 55], vertical: [true, true, true], quantity: 39 },
      ],
      warnings: [],
    });
  });

  it('reads thpack8 (no seed field) and reports the 7-field lines of thpack9 problems 18–20', () => {
    const ln = parseThpack(read('orlib-thpack/thpack8.txt'));
    expect(ln).toHaveLength(15);
    expect(ln[0].seed).toBeUndefined();
    expect(ln[0].container).toEqual([3000, 2000, 1000]);
    const imm = parseThpack(read('orlib-thpack/thpack9.txt'));
    expect(imm).toHaveLength(47);
    expect(imm.filter((p) => p.warnings.length > 0).map((p) => p.problem)).toEqual([18, 19, 20]);
  });

  it('thpack1–7 equal BR1–7', () => {
    for (let k = 1; k <= 7; k++) expect(parseThpack(read(`orlib-thpack/thpack${k}.txt`))).toEqual(parseThpack(read(`br-0-15/BR${k}.txt`)));
  });

  it('the generator reproduces all 1,600 BR0–BR15 instances field for field', () => {
    for (let k = 0; k <= 15; k++) {
      const file = parseThpack(read(`br-0-15/BR${k}.txt`));
      expect(file).toHaveLength(100);
      expect(file[0].boxes).toHaveLength(BR_TYPES[k]);
      for (const inst of file) expect(generateBr(k, inst.problem)).toEqual(inst);
    }
  });
});

describe('3D-BPP (MPV) files', () => {
  it('parses class 1, n = 50, instance 1', () => {
    const inst = parseMpv(read('mpv-3dbpp/1_50/1.txt'));
    expect(inst.bin).toEqual([100, 100, 100]);
    expect(inst.items).toHaveLength(50);
    expect(inst.items[0]).toEqual([39, 85, 72]);
  });

  it('the generator reproduces all 320 instances field for field', () => {
    for (let cls = 1; cls <= 8; cls++)
      for (const n of [50, 100, 150, 200])
        for (let v = 1; v <= 10; v++) expect(generateMpv(cls, n, v)).toEqual(parseMpv(read(`mpv-3dbpp/${cls}_${n}/${v}.txt`)));
  });

  it('L0 of the saved bound table follows from the parsed items (⌈Σ volume / bin volume⌉)', () => {
    const rows = read('mpv-3dbpp/L0-continuous-bound.csv').trim().split('\n').slice(1);
    expect(rows).toHaveLength(320);
    for (const r of rows) {
      const [cls, n, v, W, H, D, vol, l0] = r.split(',').map(Number);
      const inst = parseMpv(read(`mpv-3dbpp/${cls}_${n}/${v}.txt`));
      const sum = inst.items.reduce((s, d) => s + d[0] * d[1] * d[2], 0);
      expect(sum).toBe(vol);
      expect(Math.ceil(sum / (W * H * D))).toBe(l0);
    }
  });
});
