import { useLayoutEffect, useMemo, useRef } from 'react';
import { Canvas } from '@react-three/fiber';
import { Html, OrbitControls } from '@react-three/drei';
import { BoxGeometry, BufferGeometry, Float32BufferAttribute, type InstancedMesh, Matrix4, Vector3 } from 'three';
import { coreToThree, placement, toThreePoint } from './frame.ts';

type Vec3 = [number, number, number];
type Mat3 = [[number, number, number], [number, number, number], [number, number, number]];
export interface SceneBox3 {
  minMm: Vec3;
  maxMm: Vec3;
}

/** Where one unit of a part sits: its own frame turned by `rotation` and moved to `positionMm` (core frame). */
export interface ScenePlacement {
  positionMm: Vec3;
  rotation: Mat3;
}

/** A part (or add-on) drawn as a box. Without placements the box is already in the machine frame. */
export interface ScenePart {
  id: string;
  boxMm: SceneBox3;
  placements: ScenePlacement[] | null;
  kind: 'part' | 'addOn';
}

/** A part drawn with its own mesh (triangles in mm, in the part's frame or the machine's). */
export interface SceneMesh {
  id: string;
  trianglesMm: ArrayLike<number>;
  placements: ScenePlacement[] | null;
}

export interface SectionSceneProps {
  parts: ScenePart[];
  meshes: SceneMesh[];
  cogMm: Vec3 | null;
  bboxMm: SceneBox3 | null;
  /** Formats a length in mm for the dimension labels (the person's units). */
  formatLength: (mm: number) => string;
}

const COLORS = { part: '#6cc1b7', addOn: '#f3c164', mesh: '#22877e', cog: '#b3322a', box: '#394151' };
const IDENTITY: Mat3 = [
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
];

/** One instanced mesh of unit cubes: thousands of part boxes in one draw call. */
function PartBoxes({ parts, kind }: { parts: ScenePart[]; kind: 'part' | 'addOn' }) {
  const ref = useRef<InstancedMesh>(null);
  const matrices = useMemo(() => {
    const toThree = coreToThree();
    const out: Matrix4[] = [];
    for (const p of parts) {
      if (p.kind !== kind) continue;
      const size = new Vector3(...p.boxMm.maxMm.map((v, i) => Math.max(v - p.boxMm.minMm[i], 1)));
      const centre = p.boxMm.minMm.map((v, i) => (v + p.boxMm.maxMm[i]) / 2) as Vec3;
      const local = new Matrix4().makeTranslation(centre[0], centre[1], centre[2]).multiply(new Matrix4().makeScale(size.x, size.y, size.z));
      for (const pl of p.placements ?? [{ positionMm: [0, 0, 0] as Vec3, rotation: IDENTITY }]) {
        out.push(toThree.clone().multiply(placement(pl.rotation, pl.positionMm)).multiply(local));
      }
    }
    return out;
  }, [parts, kind]);
  const geometry = useMemo(() => new BoxGeometry(1, 1, 1), []);
  useLayoutEffect(() => {
    const mesh = ref.current;
    if (!mesh) return;
    matrices.forEach((m, i) => mesh.setMatrixAt(i, m));
    mesh.instanceMatrix.needsUpdate = true;
    mesh.computeBoundingSphere();
  }, [matrices]);
  if (matrices.length === 0) return null;
  return (
    <instancedMesh ref={ref} args={[geometry, undefined, matrices.length]} key={matrices.length}>
      <meshStandardMaterial color={COLORS[kind]} transparent opacity={0.75} />
    </instancedMesh>
  );
}

function PartMesh({ mesh }: { mesh: SceneMesh }) {
  const geometry = useMemo(() => {
    const g = new BufferGeometry();
    g.setAttribute('position', new Float32BufferAttribute(Float32Array.from(mesh.trianglesMm), 3));
    g.computeVertexNormals();
    return g;
  }, [mesh.trianglesMm]);
  const toThree = useMemo(() => coreToThree(), []);
  return (
    <>
      {(mesh.placements ?? [{ positionMm: [0, 0, 0] as Vec3, rotation: IDENTITY }]).map((pl, i) => (
        <mesh key={i} geometry={geometry} matrixAutoUpdate={false} matrix={toThree.clone().multiply(placement(pl.rotation, pl.positionMm))}>
          <meshStandardMaterial color={COLORS.mesh} />
        </mesh>
      ))}
    </>
  );
}

/** The section's box as edges, with its length, width and height written on three of them. */
function Dimensions({ box, formatLength }: { box: SceneBox3; formatLength: (mm: number) => string }) {
  const [x0, y0, z0] = box.minMm;
  const [x1, y1, z1] = box.maxMm;
  const corners: Vec3[] = [
    [x0, y0, z0],
    [x1, y0, z0],
    [x1, y1, z0],
    [x0, y1, z0],
    [x0, y0, z1],
    [x1, y0, z1],
    [x1, y1, z1],
    [x0, y1, z1],
  ];
  const edges = [0, 1, 1, 2, 2, 3, 3, 0, 4, 5, 5, 6, 6, 7, 7, 4, 0, 4, 1, 5, 2, 6, 3, 7];
  const positions = new Float32Array(edges.flatMap((i) => toThreePoint(corners[i]).toArray()));
  const label = (p: Vec3, text: string) => (
    <Html position={toThreePoint(p)} center style={{ pointerEvents: 'none' }}>
      <span className="rounded bg-white/90 px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap text-ink-900 shadow">{text}</span>
    </Html>
  );
  return (
    <group>
      <lineSegments>
        <bufferGeometry>
          <bufferAttribute attach="attributes-position" args={[positions, 3]} />
        </bufferGeometry>
        <lineBasicMaterial color={COLORS.box} />
      </lineSegments>
      {label([(x0 + x1) / 2, y0, z0], `L ${formatLength(x1 - x0)}`)}
      {label([x1, (y0 + y1) / 2, z0], `W ${formatLength(y1 - y0)}`)}
      {label([x0, y0, (z0 + z1) / 2], `H ${formatLength(z1 - z0)}`)}
    </group>
  );
}

/** Axes of the machine frame (x, y, z up) at the section's corner, so the view reads like the numbers. */
function Axes({ originMm, lengthMm }: { originMm: Vec3; lengthMm: number }) {
  const axes: { dir: Vec3; color: string; name: string }[] = [
    { dir: [1, 0, 0], color: '#d0463a', name: 'x' },
    { dir: [0, 1, 0], color: '#389857', name: 'y' },
    { dir: [0, 0, 1], color: '#186d67', name: 'z' },
  ];
  return (
    <group>
      {axes.map((a) => {
        const end: Vec3 = [originMm[0] + a.dir[0] * lengthMm, originMm[1] + a.dir[1] * lengthMm, originMm[2] + a.dir[2] * lengthMm];
        const pos = new Float32Array([...toThreePoint(originMm).toArray(), ...toThreePoint(end).toArray()]);
        return (
          <group key={a.name}>
            <lineSegments>
              <bufferGeometry>
                <bufferAttribute attach="attributes-position" args={[pos, 3]} />
              </bufferGeometry>
              <lineBasicMaterial color={a.color} />
            </lineSegments>
            <Html position={toThreePoint(end)} center style={{ pointerEvents: 'none' }}>
              <span className="text-xs font-bold" style={{ color: a.color }}>
                {a.name}
              </span>
            </Html>
          </group>
        );
      })}
    </group>
  );
}

/** The CoG as a red ball with a plumb line to the section's floor. */
function CogMarker({ cogMm, floorZMm, radiusMm, formatLength }: { cogMm: Vec3; floorZMm: number; radiusMm: number; formatLength: (mm: number) => string }) {
  const p = toThreePoint(cogMm);
  const plumb = new Float32Array([...p.toArray(), ...toThreePoint([cogMm[0], cogMm[1], floorZMm]).toArray()]);
  return (
    <group>
      <mesh position={p}>
        <sphereGeometry args={[radiusMm / 1000, 24, 16]} />
        <meshStandardMaterial color={COLORS.cog} depthTest={false} transparent />
      </mesh>
      <lineSegments>
        <bufferGeometry>
          <bufferAttribute attach="attributes-position" args={[plumb, 3]} />
        </bufferGeometry>
        <lineDashedMaterial color={COLORS.cog} />
      </lineSegments>
      <Html position={p} style={{ pointerEvents: 'none' }}>
        <span className="ml-3 rounded bg-danger-600 px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap text-white">
          CoG {cogMm.map((v) => formatLength(v)).join(', ')}
        </span>
      </Html>
    </group>
  );
}

/**
 * A section in 3D: its parts as boxes (or meshes), add-ons in a second colour, the CoG marked with a plumb
 * line, the section's box with its dimensions, and the machine axes. All inputs are in the core frame (z up,
 * mm); the conversion to three.js happens here only (frame.ts).
 */
export function SectionScene({ parts, meshes, cogMm, bboxMm, formatLength }: SectionSceneProps) {
  const box = bboxMm ?? { minMm: [-500, -500, 0] as Vec3, maxMm: [500, 500, 1000] as Vec3 };
  const size = box.maxMm.map((v, i) => v - box.minMm[i]);
  const diag = Math.hypot(size[0], size[1], size[2]) || 1000;
  const centre = toThreePoint(box.minMm.map((v, i) => (v + box.maxMm[i]) / 2) as Vec3);
  const eye = centre.clone().add(new Vector3(diag, diag * 0.8, diag).multiplyScalar(0.001 * 0.9));
  return (
    <Canvas camera={{ position: eye.toArray(), fov: 40, near: 0.01, far: 1000 }} frameloop="demand" dpr={[1, 2]}>
      <color attach="background" args={['#f8f7f3']} />
      <ambientLight intensity={0.7} />
      <directionalLight position={[5, 10, 7]} intensity={1.2} />
      <PartBoxes parts={parts} kind="part" />
      <PartBoxes parts={parts} kind="addOn" />
      {meshes.map((m) => (
        <PartMesh key={m.id} mesh={m} />
      ))}
      {bboxMm && <Dimensions box={bboxMm} formatLength={formatLength} />}
      <Axes originMm={box.minMm} lengthMm={Math.max(200, diag * 0.15)} />
      {cogMm && <CogMarker cogMm={cogMm} floorZMm={box.minMm[2]} radiusMm={Math.max(15, diag * 0.015)} formatLength={formatLength} />}
      <OrbitControls target={centre} makeDefault />
    </Canvas>
  );
}

export default SectionScene;
