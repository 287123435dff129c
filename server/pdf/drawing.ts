import { COLORS, pdfSafe, type PdfWriter } from './document.ts';

/**
 * A framed drawing view on the page: world coordinates (mm, u to the right, v up) fitted into a box
 * at one scale on both axes, with a title and a scale bar. Used for plan and elevation views.
 */
export class Viewport {
  readonly scale: number;
  private readonly ox: number;
  private readonly oy: number;

  constructor(
    readonly w: PdfWriter,
    readonly box: { x: number; y: number; width: number; height: number },
    world: { minU: number; maxU: number; minV: number; maxV: number },
    readonly title: string,
  ) {
    const pad = 18;
    const du = Math.max(world.maxU - world.minU, 1);
    const dv = Math.max(world.maxV - world.minV, 1);
    this.scale = Math.min((box.width - 2 * pad) / du, (box.height - 2 * pad - 14) / dv);
    const cu = (world.minU + world.maxU) / 2;
    const cv = (world.minV + world.maxV) / 2;
    this.ox = box.x + box.width / 2 - cu * this.scale;
    this.oy = box.y + 14 + (box.height - 14) / 2 + cv * this.scale;
    const d = w.doc;
    d.save().rect(box.x, box.y, box.width, box.height).lineWidth(0.6).strokeColor(COLORS.rule).stroke().restore();
    d.font('bold').fontSize(9).fillColor(COLORS.muted).text(title, box.x + 6, box.y + 5, { width: box.width - 12, lineBreak: false });
    this.scaleBar();
  }

  /** Page position of a world point. */
  at(u: number, v: number): [number, number] {
    return [this.ox + u * this.scale, this.oy - v * this.scale];
  }

  line(a: [number, number], b: [number, number], opts: { color?: string; width?: number; dash?: number } = {}): void {
    const d = this.w.doc;
    d.save();
    const [x1, y1] = this.at(a[0], a[1]);
    const [x2, y2] = this.at(b[0], b[1]);
    d.moveTo(x1, y1).lineTo(x2, y2).lineWidth(opts.width ?? 1).strokeColor(opts.color ?? COLORS.ink);
    if (opts.dash) d.dash(opts.dash, { space: opts.dash });
    d.stroke().restore();
  }

  rect(min: [number, number], max: [number, number], opts: { color?: string; fill?: string; width?: number; dash?: number } = {}): void {
    const d = this.w.doc;
    const [x1, y1] = this.at(min[0], max[1]);
    const [x2, y2] = this.at(max[0], min[1]);
    d.save().rect(x1, y1, x2 - x1, y2 - y1).lineWidth(opts.width ?? 1);
    if (opts.dash) d.dash(opts.dash, { space: opts.dash });
    if (opts.fill) d.fillOpacity(0.5).fillAndStroke(opts.fill, opts.color ?? COLORS.ink);
    else d.strokeColor(opts.color ?? COLORS.ink).stroke();
    d.restore();
  }

  dot(p: [number, number], radiusPt: number, color: string): void {
    const [x, y] = this.at(p[0], p[1]);
    this.w.doc.save().circle(x, y, radiusPt).fill(color).restore();
  }

  /** The CoG symbol: a circle with two filled quarters. */
  cog(p: [number, number], radiusPt = 5): void {
    const [x, y] = this.at(p[0], p[1]);
    const d = this.w.doc;
    d.save().circle(x, y, radiusPt).lineWidth(0.8).fillAndStroke('#ffffff', COLORS.ink);
    const r = radiusPt;
    d.path(`M ${x} ${y} L ${x + r} ${y} A ${r} ${r} 0 0 1 ${x} ${y + r} Z`).fill(COLORS.ink);
    d.path(`M ${x} ${y} L ${x - r} ${y} A ${r} ${r} 0 0 1 ${x} ${y - r} Z`).fill(COLORS.ink);
    d.restore();
  }

  label(p: [number, number], text: string, opts: { dx?: number; dy?: number; color?: string; size?: number; bold?: boolean } = {}): void {
    const [x, y] = this.at(p[0], p[1]);
    this.w.doc
      .font(opts.bold ? 'bold' : 'regular')
      .fontSize(opts.size ?? 7.5)
      .fillColor(opts.color ?? COLORS.ink)
      .text(pdfSafe(text), x + (opts.dx ?? 4), y + (opts.dy ?? -9), { lineBreak: false });
  }

  private scaleBar(): void {
    // A round length near a quarter of the view width.
    const target = (this.box.width / 4) / this.scale;
    const pow = 10 ** Math.floor(Math.log10(target));
    const len = [1, 2, 5, 10].map((m) => m * pow).filter((l) => l <= target).pop() ?? pow;
    const d = this.w.doc;
    const x = this.box.x + this.box.width - 10 - len * this.scale;
    const y = this.box.y + this.box.height - 8;
    d.save().moveTo(x, y).lineTo(x + len * this.scale, y).lineWidth(1.2).strokeColor(COLORS.muted).stroke().restore();
    d.font('regular').fontSize(7).fillColor(COLORS.muted).text(`${len >= 1000 ? `${len / 1000} m` : `${len} mm`}`, x, y - 9, { width: len * this.scale, align: 'center', lineBreak: false });
  }
}
