import { useMemo } from 'react';
import { Canvas, type ThreeEvent } from '@react-three/fiber';
import { Html, OrbitControls } from '@react-three/drei';
import { Vector3 } from 'three';
import type { LiftPlanInput, LiftPlanResult } from '@domain/lifting/index.ts';
import { METRES_PER_MM, toThreePoint } from '../../../viewer/frame.ts';

type Vec3 = [number, number, number];

export interface Plan3dProps {
  input: LiftPlanInput;
  result: LiftPlanResult;
  formatMass: (kg: number) => string;
  /** Called with a point on the section's box (core frame, mm) when the person clicks it. */
  onPick?: (pointMm: Vec3) => void;
}

const COLORS = { load: '#6cc1b7', cog: '#b3322a', unc: '#1f6f8b', pick: '#b3322a', sling: '#1f6f8b', hook: '#1b232b', zone: '#d9534f' };

/** Hook and leg lines in the load's frame: one hook from the core's hanging geometry, vertical legs otherwise. */
function rigging(input: LiftPlanInput, result: LiftPlanResult): { hook: Vec3 | null; legs: [Vec3, Vec3][] } {
  const picks = input.pickPoints.map((p) => p.positionMm as Vec3);
  if (picks.length === 0) return { hook: null, legs: [] };
  if (input.suspension.kind === 'single-hook') {
    const hook = result.hanging?.hookInLoadMm ?? null;
    return { hook, legs: hook ? picks.map((p) => [p, hook]) : [] };
  }
  const top = Math.max(...picks.map((p) => p[2])) + 900;
  const legs: [Vec3, Vec3][] = picks.map((p) => [p, [p[0], p[1], top]]);
  if (input.suspension.kind === 'spreader-beam') {
    const hook: Vec3 = [input.load.cogMm[0], input.load.cogMm[1], top + 900];
    const xs = picks.map((p) => p[0]);
    legs.push([[Math.min(...xs), input.load.cogMm[1], top], [Math.max(...xs), input.load.cogMm[1], top]]);
    return { hook, legs: [...legs, [[Math.min(...xs), input.load.cogMm[1], top], hook], [[Math.max(...xs), input.load.cogMm[1], top], hook]] };
  }
  return { hook: null, legs };
}

function Line({ a, b, color }: { a: Vec3; b: Vec3; color: string }) {
  const positions = useMemo(() => new Float32Array([...toThreePoint(a).toArray(), ...toThreePoint(b).toArray()]), [a, b]);
  return (
    <lineSegments>
      <bufferGeometry>
        <bufferAttribute attach="attributes-position" args={[positions, 3]} />
      </bufferGeometry>
      <lineBasicMaterial color={color} />
    </lineSegments>
  );
}

function BoxAt({ min, max, color, wire, opacity = 1, onClick }: { min: Vec3; max: Vec3; color: string; wire?: boolean; opacity?: number; onClick?: (e: ThreeEvent<MouseEvent>) => void }) {
  const centre = toThreePoint([(min[0] + max[0]) / 2, (min[1] + max[1]) / 2, (min[2] + max[2]) / 2]);
  // three's axes: x = core x, y = core z, z = −core y.
  const size: Vec3 = [(max[0] - min[0]) * METRES_PER_MM, (max[2] - min[2]) * METRES_PER_MM, (max[1] - min[1]) * METRES_PER_MM];
  return (
    <mesh position={centre} onClick={onClick}>
      <boxGeometry args={size} />
      <meshStandardMaterial color={color} wireframe={wire} transparent={opacity < 1} opacity={opacity} />
    </mesh>
  );
}

/**
 * The lift in 3D: the section's box, its CoG with the uncertainty box, pick points, slings, hook, each
 * leg's worst tension and the exclusion zone on the floor. Drawn in the load's own frame as it stands
 * (the tilt is stated, not drawn). Loaded lazily: three.js is a large chunk.
 */
export default function Plan3d({ input, result, formatMass, onPick }: Plan3dProps) {
  const b = input.load.boundsMm;
  const cog = input.load.cogMm as Vec3;
  const unc = input.load.cogUncertainty && 'plusMinusMm' in input.load.cogUncertainty ? input.load.cogUncertainty.plusMinusMm : null;
  const { hook, legs } = rigging(input, result);
  const tension = new Map(result.legs.map((l) => [l.pickPointId, l.worstTensionKg]));
  const pts: Vec3[] = [cog, ...input.pickPoints.map((p) => p.positionMm as Vec3), ...(hook ? [hook] : [])];
  if (b) pts.push(b.minMm as Vec3, b.maxMm as Vec3);
  const lo = [0, 1, 2].map((i) => Math.min(...pts.map((p) => p[i]))) as Vec3;
  const hi = [0, 1, 2].map((i) => Math.max(...pts.map((p) => p[i]))) as Vec3;
  const centre = toThreePoint([(lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2, (lo[2] + hi[2]) / 2]);
  const diag = Math.hypot(hi[0] - lo[0], hi[1] - lo[1], hi[2] - lo[2]) * METRES_PER_MM || 1;
  const eye = centre.clone().add(new Vector3(diag, diag * 0.7, diag).multiplyScalar(0.9));
  const r = Math.max(0.015, diag * 0.012);
  const zone = result.exclusionZone;
  const floor = b ? b.minMm[2] : lo[2];

  const pick = (e: ThreeEvent<MouseEvent>) => {
    if (!onPick) return;
    e.stopPropagation();
    const p = e.point;
    onPick([Math.round(p.x / METRES_PER_MM), Math.round(-p.z / METRES_PER_MM), Math.round(p.y / METRES_PER_MM)]);
  };

  return (
    <Canvas camera={{ position: eye.toArray(), fov: 40, near: 0.01, far: 1000 }} frameloop="demand" dpr={[1, 2]}>
      <color attach="background" args={['#f8f7f3']} />
      <ambientLight intensity={0.75} />
      <directionalLight position={[5, 10, 7]} intensity={1.1} />
      {b && <BoxAt min={b.minMm as Vec3} max={b.maxMm as Vec3} color={COLORS.load} opacity={0.45} onClick={pick} />}
      {unc && <BoxAt min={[cog[0] - unc[0], cog[1] - unc[1], cog[2] - unc[2]]} max={[cog[0] + unc[0], cog[1] + unc[1], cog[2] + unc[2]]} color={COLORS.unc} wire />}
      {zone && <BoxAt min={[zone.minXMm, zone.minYMm, floor - 2]} max={[zone.maxXMm, zone.maxYMm, floor]} color={COLORS.zone} opacity={0.18} />}
      <mesh position={toThreePoint(cog)}>
        <sphereGeometry args={[r * 1.3, 20, 14]} />
        <meshStandardMaterial color={COLORS.cog} />
      </mesh>
      <Html position={toThreePoint(cog)} style={{ pointerEvents: 'none' }}>
        <span className="ml-3 rounded bg-danger-600 px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap text-white">CoG</span>
      </Html>
      {legs.map(([a, c], i) => (
        <Line key={i} a={a} b={c} color={COLORS.sling} />
      ))}
      {input.pickPoints.map((p) => (
        <group key={p.id}>
          <mesh position={toThreePoint(p.positionMm as Vec3)}>
            <sphereGeometry args={[r, 16, 12]} />
            <meshStandardMaterial color={COLORS.pick} />
          </mesh>
          <Html position={toThreePoint(p.positionMm as Vec3)} style={{ pointerEvents: 'none' }}>
            <span className="ml-2 rounded bg-white/90 px-1 text-xs font-semibold whitespace-nowrap text-ink-900">
              {p.id}
              {tension.has(p.id) ? `: ${formatMass(tension.get(p.id)!)}` : ''}
            </span>
          </Html>
        </group>
      ))}
      {hook && (
        <>
          <mesh position={toThreePoint(hook)}>
            <sphereGeometry args={[r * 1.2, 16, 12]} />
            <meshStandardMaterial color={COLORS.hook} />
          </mesh>
          <Html position={toThreePoint(hook)} style={{ pointerEvents: 'none' }}>
            <span className="ml-2 rounded bg-ink-900 px-1 text-xs font-semibold whitespace-nowrap text-white">
              Hook{result.loads ? ` ${formatMass(result.loads.dynamicHookLoadKg)} dyn.` : ''}
            </span>
          </Html>
        </>
      )}
      <OrbitControls target={centre} makeDefault />
    </Canvas>
  );
}
