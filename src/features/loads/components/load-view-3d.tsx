import { useLayoutEffect, useMemo, useRef } from 'react';
import { Canvas, type ThreeEvent } from '@react-three/fiber';
import { OrbitControls } from '@react-three/drei';
import { BoxGeometry, Color, type InstancedMesh, Matrix4, SphereGeometry } from 'three';
import { coreToThree, toThreePoint } from '../../../viewer/frame.ts';

type Vec3 = [number, number, number];

export interface SceneCrate {
  id: string;
  code: string;
  xMm: number;
  yMm: number;
  zMm: number;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  color: string;
  cogMm: Vec3;
  pinned?: boolean;
}

export interface LoadSceneProps {
  spaceMm: Vec3;
  crates: SceneCrate[];
  loadCogMm: Vec3 | null;
  selectedId: string | null;
  onSelect: (id: string | null) => void;
}

/** All crates in one instanced mesh of unit cubes, each scaled, placed and coloured per instance. */
function Crates({ crates, selectedId, onSelect }: Pick<LoadSceneProps, 'crates' | 'selectedId' | 'onSelect'>) {
  const ref = useRef<InstancedMesh>(null);
  const geometry = useMemo(() => new BoxGeometry(1, 1, 1), []);
  useLayoutEffect(() => {
    const mesh = ref.current;
    if (!mesh) return;
    const toThree = coreToThree();
    const gap = 6; // mm, so neighbouring crates read as separate boxes
    crates.forEach((c, i) => {
      const m = toThree
        .clone()
        .multiply(new Matrix4().makeTranslation(c.xMm + c.lengthMm / 2, c.yMm + c.widthMm / 2, c.zMm + c.heightMm / 2))
        .multiply(new Matrix4().makeScale(Math.max(c.lengthMm - gap, 1), Math.max(c.widthMm - gap, 1), Math.max(c.heightMm - gap, 1)));
      mesh.setMatrixAt(i, m);
      mesh.setColorAt(i, new Color(c.id === selectedId ? '#f3c164' : c.color));
    });
    mesh.count = crates.length;
    mesh.instanceMatrix.needsUpdate = true;
    if (mesh.instanceColor) mesh.instanceColor.needsUpdate = true;
    mesh.computeBoundingSphere();
  }, [crates, selectedId]);
  if (crates.length === 0) return null;
  return (
    <instancedMesh
      ref={ref}
      args={[geometry, undefined, Math.max(crates.length, 1)]}
      key={crates.length}
      onClick={(e: ThreeEvent<MouseEvent>) => {
        e.stopPropagation();
        const c = e.instanceId === undefined ? undefined : crates[e.instanceId];
        onSelect(c ? c.id : null);
      }}
    >
      <meshStandardMaterial transparent opacity={0.85} />
    </instancedMesh>
  );
}

/** Each crate's CoG as a small dark ball (one instanced mesh). */
function CrateCogs({ crates }: { crates: SceneCrate[] }) {
  const ref = useRef<InstancedMesh>(null);
  const geometry = useMemo(() => new SphereGeometry(0.04, 12, 8), []);
  useLayoutEffect(() => {
    const mesh = ref.current;
    if (!mesh) return;
    crates.forEach((c, i) => mesh.setMatrixAt(i, new Matrix4().setPosition(toThreePoint(c.cogMm))));
    mesh.count = crates.length;
    mesh.instanceMatrix.needsUpdate = true;
    mesh.computeBoundingSphere();
  }, [crates]);
  if (crates.length === 0) return null;
  return (
    <instancedMesh ref={ref} args={[geometry, undefined, Math.max(crates.length, 1)]} key={crates.length}>
      <meshBasicMaterial color="#1d2430" depthTest={false} transparent />
    </instancedMesh>
  );
}

/** The load space as edges. */
function Space({ spaceMm }: { spaceMm: Vec3 }) {
  const [L, W, H] = spaceMm;
  const c: Vec3[] = [
    [0, 0, 0],
    [L, 0, 0],
    [L, W, 0],
    [0, W, 0],
    [0, 0, H],
    [L, 0, H],
    [L, W, H],
    [0, W, H],
  ];
  const edges = [0, 1, 1, 2, 2, 3, 3, 0, 4, 5, 5, 6, 6, 7, 7, 4, 0, 4, 1, 5, 2, 6, 3, 7];
  const positions = useMemo(() => new Float32Array(edges.flatMap((i) => toThreePoint(c[i]).toArray())), [L, W, H]); // eslint-disable-line react-hooks/exhaustive-deps
  return (
    <lineSegments>
      <bufferGeometry>
        <bufferAttribute attach="attributes-position" args={[positions, 3]} />
      </bufferGeometry>
      <lineBasicMaterial color="#394151" />
    </lineSegments>
  );
}

/**
 * The load in 3D: the vehicle's load space (x from the front wall to the doors, z up; core frame,
 * converted only through viewer/frame.ts), crates as instanced boxes coloured by the caller, each
 * crate's CoG, and the load's CoG as a red ball with a plumb line to the floor. Click a crate to pick it.
 */
export default function LoadView3d({ spaceMm, crates, loadCogMm, selectedId, onSelect }: LoadSceneProps) {
  const centre = toThreePoint([spaceMm[0] / 2, spaceMm[1] / 2, 0]);
  const far = Math.max(...spaceMm) / 1000;
  const plumb = loadCogMm ? new Float32Array([...toThreePoint(loadCogMm).toArray(), ...toThreePoint([loadCogMm[0], loadCogMm[1], 0]).toArray()]) : null;
  return (
    <Canvas camera={{ position: [centre.x + far * 0.5, far * 0.6, centre.z + far * 0.9], fov: 40, near: 0.05, far: far * 10 }} onPointerMissed={() => onSelect(null)} data-testid="load-canvas">
      <ambientLight intensity={0.7} />
      <directionalLight position={[10, 20, 10]} intensity={1.2} />
      <Space spaceMm={spaceMm} />
      <Crates crates={crates} selectedId={selectedId} onSelect={onSelect} />
      <CrateCogs crates={crates} />
      {loadCogMm && plumb && (
        <group>
          <mesh position={toThreePoint(loadCogMm)}>
            <sphereGeometry args={[0.12, 24, 16]} />
            <meshStandardMaterial color="#b3322a" depthTest={false} transparent />
          </mesh>
          <lineSegments>
            <bufferGeometry>
              <bufferAttribute attach="attributes-position" args={[plumb, 3]} />
            </bufferGeometry>
            <lineBasicMaterial color="#b3322a" />
          </lineSegments>
        </group>
      )}
      <OrbitControls target={centre} makeDefault />
    </Canvas>
  );
}
