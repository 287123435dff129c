/**
 * Hand-to-object coupling class for the NIOSH equation (Applications Manual, NIOSH 94-110, 2021 rev.,
 * Table 6 and its notes, p. 17, and the decision tree, p. 18; Table 7 turns the class into CM).
 *
 * Table 6 note 3: an optimal container has ≤ 40 cm frontal length and ≤ 30 cm height and a smooth
 * non-slip surface; note 5: a container longer than 40 cm, higher than 30 cm, rough or slippery, with
 * sharp edges, an asymmetric centre of mass, unstable contents, or needing gloves is less than optimal.
 * A less-than-optimal container is classed poor (Table 6, "poor" 1; decision tree). The manual adds
 * (p. 16): "If there is any doubt about classifying a particular coupling design, the more stressful
 * classification should be selected." So unknown answers fall to the worse class here.
 *
 * Note: Ballast's reference sheet also records a reading that a large container with optimal handles
 * is "good"; the decision tree as transcribed classes every non-optimal container poor, which is the
 * more stressful class and the one used here.
 */
import type { Coupling } from './niosh-tables.ts';

export interface CouplingInput {
  kind: 'container' | 'loose-object';
  /** Container: frontal length (across the body), cm. */
  frontalLengthCm?: number;
  /** Container: height, cm. */
  heightCm?: number;
  /** Container: rough or slippery surface, sharp edges, asymmetric centre of mass, unstable contents, or gloves needed. */
  otherwiseNotOptimal?: boolean;
  /** Container: handles or hand-hold cut-outs, and whether they meet the Table 6 notes 1–2. */
  handles?: 'optimal' | 'not optimal' | 'none';
  /** Loose object: cannot easily be balanced between the hand grasps. */
  bulky?: boolean;
  /** Loose object: the hand can wrap comfortably around it. */
  optimalGrip?: boolean;
  /** The fingers can be flexed about 90° under the object (note 4). */
  fingersFlexed90?: boolean;
}

export function classifyCoupling(input: CouplingInput): { coupling: Coupling; reasons: string[] } {
  const reasons: string[] = [];
  if (input.kind === 'container') {
    const len = input.frontalLengthCm;
    const h = input.heightCm;
    let optimal = true;
    if (len === undefined || !Number.isFinite(len)) {
      optimal = false;
      reasons.push('Frontal length unknown: treated as not optimal (manual p. 16: in doubt, the more stressful class).');
    } else if (len > 40) {
      optimal = false;
      reasons.push(`Frontal length ${len} cm is over 40 cm: container not optimal (Table 6 notes 3 and 5).`);
    }
    if (h === undefined || !Number.isFinite(h)) {
      optimal = false;
      reasons.push('Height unknown: treated as not optimal (manual p. 16).');
    } else if (h > 30) {
      optimal = false;
      reasons.push(`Height ${h} cm is over 30 cm: container not optimal (Table 6 notes 3 and 5).`);
    }
    if (input.otherwiseNotOptimal) {
      optimal = false;
      reasons.push('Surface, edges, centre of mass, contents or gloves make the container not optimal (Table 6 note 5).');
    }
    if (!optimal) {
      reasons.push('A container of less than optimal design couples poorly (Table 6, decision tree p. 18).');
      return { coupling: 'poor', reasons };
    }
    if (input.handles === 'optimal') {
      reasons.push('Optimal container with optimal handles or cut-outs: good (Table 6).');
      return { coupling: 'good', reasons };
    }
    if (input.fingersFlexed90) {
      reasons.push('Optimal container, handles not optimal or none, fingers flex about 90°: fair (Table 6).');
      return { coupling: 'fair', reasons };
    }
    reasons.push('Optimal container, handles not optimal or none, fingers cannot flex 90° (or unknown): poor (Table 6).');
    return { coupling: 'poor', reasons };
  }
  if (input.bulky !== false) {
    reasons.push(input.bulky ? 'Bulky loose object: poor (Table 6).' : 'Unknown whether the object is bulky: treated as poor (manual p. 16).');
    return { coupling: 'poor', reasons };
  }
  if (input.optimalGrip) {
    reasons.push('Loose object, not bulky, the hand wraps around it: good (Table 6).');
    return { coupling: 'good', reasons };
  }
  if (input.fingersFlexed90) {
    reasons.push('Loose object, grip not optimal, fingers flex about 90°: fair (Table 6).');
    return { coupling: 'fair', reasons };
  }
  reasons.push('Loose object, grip not optimal, fingers cannot flex 90° (or unknown): poor (Table 6).');
  return { coupling: 'poor', reasons };
}
