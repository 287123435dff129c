/**
 * Triangle meshes of analytic solids for the mass tests and the benchmark: every face counter-clockwise
 * seen from outside, corners shared exactly (built from an indexed vertex list, as CAD exports do).
 */

export type V3 = [number, number, number];

/** Flattens an indexed mesh into 9 numbers per triangle. */
export function flatten(vertices: readonly V3[], faces: readonly [number, number, number][]): number[] {
  const out: number[] = [];
  for (const f of faces) for (const i of f) out.push(vertices[i][0], vertices[i][1], vertices[i][2]);
  return out;
}

/** Reverses every triangle's winding (an inside-out mesh). */
export function reverseWinding(t: ArrayLike<number>): number[] {
  const out: number[] = [];
  for (let k = 0; k < t.length; k += 9) {
    out.push(t[k], t[k + 1], t[k + 2], t[k + 6], t[k + 7], t[k + 8], t[k + 3], t[k + 4], t[k + 5]);
  }
  return out;
}

/** Applies world = R·p + d to every corner. */
export function transform(t: ArrayLike<number>, r: number[][], d: V3): number[] {
  const out: number[] = [];
  for (let k = 0; k < t.length; k += 3) {
    const x = t[k], y = t[k + 1], z = t[k + 2];
    for (let i = 0; i < 3; i++) out.push(r[i][0] * x + r[i][1] * y + r[i][2] * z + d[i]);
  }
  return out;
}

/** Axis-aligned cuboid with sizes a, b, c from corner `at`. */
export function cuboid(a: number, b: number, c: number, at: V3 = [0, 0, 0]): number[] {
  const v: V3[] = [];
  for (let i = 0; i < 8; i++) v.push([at[0] + (i & 1 ? a : 0), at[1] + (i & 2 ? b : 0), at[2] + (i & 4 ? c : 0)]);
  const quads = [
    [0, 2, 3, 1], // z = 0, normal −z
    [4, 5, 7, 6], // z = c, normal +z
    [0, 1, 5, 4], // y = 0, normal −y
    [2, 6, 7, 3], // y = b, normal +y
    [0, 4, 6, 2], // x = 0, normal −x
    [1, 3, 7, 5], // x = a, normal +x
  ];
  const faces: [number, number, number][] = [];
  for (const q of quads) faces.push([q[0], q[1], q[2]], [q[0], q[2], q[3]]);
  return flatten(v, faces);
}

/** Tetrahedron with outward faces, whatever the order of its corners. */
export function tetrahedron(p0: V3, p1: V3, p2: V3, p3: V3): number[] {
  const sub = (a: V3, b: V3): V3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
  const u = sub(p1, p0), v = sub(p2, p0), w = sub(p3, p0);
  const det = u[0] * (v[1] * w[2] - v[2] * w[1]) - u[1] * (v[0] * w[2] - v[2] * w[0]) + u[2] * (v[0] * w[1] - v[1] * w[0]);
  const vs: V3[] = det > 0 ? [p0, p1, p2, p3] : [p0, p2, p1, p3];
  return flatten(vs, [
    [0, 2, 1],
    [0, 1, 3],
    [1, 2, 3],
    [0, 3, 2],
  ]);
}

/** Regular n-gon prism (a cylinder approximation) of circumradius r, axis z, from z = −h/2 to h/2. */
export function prism(r: number, h: number, n: number): number[] {
  const v: V3[] = [[0, 0, -h / 2], [0, 0, h / 2]];
  for (let i = 0; i < n; i++) {
    const a = (2 * Math.PI * i) / n;
    v.push([r * Math.cos(a), r * Math.sin(a), -h / 2], [r * Math.cos(a), r * Math.sin(a), h / 2]);
  }
  const faces: [number, number, number][] = [];
  for (let i = 0; i < n; i++) {
    const b0 = 2 + 2 * i, t0 = b0 + 1, b1 = 2 + 2 * ((i + 1) % n), t1 = b1 + 1;
    faces.push([0, b1, b0], [1, t0, t1], [b0, b1, t1], [b0, t1, t0]);
  }
  return flatten(v, faces);
}

/** Latitude–longitude sphere of radius r (vertices on the sphere), nLat bands, nLon segments. */
export function uvSphere(r: number, nLat: number, nLon: number): number[] {
  const v: V3[] = [[0, 0, r], [0, 0, -r]];
  const idx = (i: number, j: number): number => 2 + (i - 1) * nLon + (j % nLon);
  for (let i = 1; i < nLat; i++) {
    const th = (Math.PI * i) / nLat;
    for (let j = 0; j < nLon; j++) {
      const ph = (2 * Math.PI * j) / nLon;
      v.push([r * Math.sin(th) * Math.cos(ph), r * Math.sin(th) * Math.sin(ph), r * Math.cos(th)]);
    }
  }
  const faces: [number, number, number][] = [];
  for (let j = 0; j < nLon; j++) {
    faces.push([0, idx(1, j), idx(1, j + 1)]);
    faces.push([1, idx(nLat - 1, j + 1), idx(nLat - 1, j)]);
    for (let i = 1; i < nLat - 1; i++) {
      faces.push([idx(i, j), idx(i + 1, j), idx(i + 1, j + 1)], [idx(i, j), idx(i + 1, j + 1), idx(i, j + 1)]);
    }
  }
  return flatten(v, faces);
}

/**
 * Torus (ring radius R, tube radius r, axis z) as a Float64Array of 2·n·m triangles, built straight into a
 * typed array (used for the 1,000,000-triangle benchmark).
 */
export function torus(R: number, r: number, n: number, m: number): Float64Array {
  const px = new Float64Array(n * m), py = new Float64Array(n * m), pz = new Float64Array(n * m);
  for (let i = 0; i < n; i++) {
    const u = (2 * Math.PI * i) / n;
    for (let j = 0; j < m; j++) {
      const w = (2 * Math.PI * j) / m;
      const k = i * m + j;
      px[k] = (R + r * Math.cos(w)) * Math.cos(u);
      py[k] = (R + r * Math.cos(w)) * Math.sin(u);
      pz[k] = r * Math.sin(w);
    }
  }
  const out = new Float64Array(n * m * 2 * 9);
  let o = 0;
  const put = (k: number): void => {
    out[o++] = px[k];
    out[o++] = py[k];
    out[o++] = pz[k];
  };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < m; j++) {
      const a = i * m + j, b = ((i + 1) % n) * m + j, c = ((i + 1) % n) * m + ((j + 1) % m), d = i * m + ((j + 1) % m);
      put(a); put(b); put(c);
      put(a); put(c); put(d);
    }
  }
  return out;
}
