/** Small display helpers for lifting figures (values stay in kg and mm; units convert through useUnits). */
export const pct = (u: number | null | undefined) => (u === null || u === undefined || !Number.isFinite(u) ? 'no rating' : `${Math.round(u * 100)} %`);
export const deg = (d: number | null | undefined, digits = 1) => (d === null || d === undefined || !Number.isFinite(d) ? '—' : `${d.toFixed(digits)}°`);
export const num = (v: number | null | undefined, digits = 2) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits));
export const today = () => new Date().toISOString().slice(0, 10);
