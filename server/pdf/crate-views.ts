import type { CrateView } from '../../src/domain/contracts/crate-loads.ts';
import { COLORS, type PdfWriter } from './document.ts';
import { Viewport } from './drawing.ts';

/**
 * Plan, front and end views of a crate with its CoG mark and corner A (the corner the CoG is measured
 * from: the crate frame's origin, outer bottom corner at x = 0, y = 0). Contents with a CoG are dots
 * numbered as in the contents table. Draws the figures it is given; computes none.
 */
export function crateViews(w: PdfWriter, crate: CrateView, heightPt = 160): void {
  const [L, W, H] = crate.outerMm;
  const cog = crate.figures.cogMm;
  const gap = 8;
  const each = (w.width - 2 * gap) / 3;
  w.ensureSpace(heightPt + 24);
  const y = w.doc.y;
  const contents = crate.contents.map((c, i) => ({ n: i + 1, cog: c.cogMm })).filter((c): c is { n: number; cog: [number, number, number] } => c.cog !== null);

  // Plan, looking down: x to the right, y up; corner A bottom left.
  const plan = new Viewport(w, { x: w.left, y, width: each, height: heightPt }, { minU: 0, maxU: L, minV: 0, maxV: W }, 'PLAN (from above)');
  plan.rect([0, 0], [L, W], { fill: '#e4e9ee', width: 1 });
  for (const c of contents) plan.dot([c.cog[0], c.cog[1]], 1.6, COLORS.muted);
  if (cog) plan.cog([cog[0], cog[1]], 6);
  corner(plan, [0, 0]);

  // Front elevation, looking along +y at the front side (y = 0): x to the right, z up; A bottom left.
  const front = new Viewport(w, { x: w.left + each + gap, y, width: each, height: heightPt }, { minU: 0, maxU: L, minV: 0, maxV: H }, 'FRONT (side y = 0)');
  front.rect([0, 0], [L, H], { fill: '#e4e9ee', width: 1 });
  for (const c of contents) front.dot([c.cog[0], c.cog[2]], 1.6, COLORS.muted);
  if (cog) front.cog([cog[0], cog[2]], 6);
  corner(front, [0, 0]);

  // End elevation, looking along +x at the end x = 0: y runs to the left, so A sits bottom right.
  const end = new Viewport(w, { x: w.left + 2 * (each + gap), y, width: each, height: heightPt }, { minU: -W, maxU: 0, minV: 0, maxV: H }, 'END (x = 0)');
  end.rect([-W, 0], [0, H], { fill: '#e4e9ee', width: 1 });
  for (const c of contents) end.dot([-c.cog[1], c.cog[2]], 1.6, COLORS.muted);
  if (cog) end.cog([-cog[1], cog[2]], 6);
  corner(end, [0, 0], -14);

  w.doc.x = w.left;
  w.doc.y = y + heightPt + 4;
  w.paragraph(
    cog
      ? 'Quartered circle: CoG of crate and contents. Grey dots: CoG of each content line. A: the corner the CoG is measured from.'
      : 'No CoG mark: the CoG is not known (see the warnings). A: the corner the CoG is measured from.',
    { color: COLORS.muted, size: 8 },
  );
}

function corner(v: Viewport, at: [number, number], dx = 4): void {
  const [x, y] = v.at(at[0], at[1]);
  v.w.doc.save().polygon([x, y], [x + (dx < 0 ? -7 : 7), y], [x, y - 7]).fill(COLORS.danger).restore();
  v.label(at, 'A', { dx: dx < 0 ? dx : dx + 4, dy: -18, bold: true, size: 9, color: COLORS.danger });
}
