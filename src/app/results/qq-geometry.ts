/** A point of a normal Q-Q plot. */
export interface QqPoint {
  theoretical: number;
  observed: number;
}

/** Everything the SVG needs, in viewBox units. */
export interface QqGeometry {
  width: number;
  height: number;
  plot: { left: number; top: number; right: number; bottom: number };
  dots: { cx: number; cy: number }[];
  line: { x1: number; y1: number; x2: number; y2: number } | null;
  xTicks: { at: number; label: string }[];
  yTicks: { at: number; label: string }[];
  /** Largest vertical distance of a point from the line, in residual units (for the text description). */
  maxGap: number;
}

function ticks(lo: number, hi: number): number[] {
  const span = hi - lo || 1;
  const raw = span / 4;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? raw;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return out;
}

function quantileOf(sorted: number[], q: number): number {
  const pos = (sorted.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (pos - lo);
}

/**
 * Lays out a Q-Q plot. The reference line passes through the first and third quartiles
 * of both axes, so a few extreme residuals do not tilt it.
 */
export function qqGeometry(points: QqPoint[], width = 360, height = 280): QqGeometry {
  const plot = { left: 48, top: 12, right: width - 12, bottom: height - 40 };
  const xs = points.map((p) => p.theoretical);
  const ys = points.map((p) => p.observed);
  const xLo = Math.min(...xs, -1), xHi = Math.max(...xs, 1);
  const yLo = Math.min(...ys), yHi = Math.max(...ys);
  const yPad = (yHi - yLo || 1) * 0.05;
  const [y0, y1] = [yLo - yPad, yHi + yPad];
  const sx = (x: number) => plot.left + ((x - xLo) / (xHi - xLo || 1)) * (plot.right - plot.left);
  const sy = (y: number) => plot.bottom - ((y - y0) / (y1 - y0 || 1)) * (plot.bottom - plot.top);
  let line: QqGeometry['line'] = null;
  let maxGap = 0;
  if (points.length >= 4) {
    const sxs = [...xs].sort((a, b) => a - b), sys = [...ys].sort((a, b) => a - b);
    const tq1 = quantileOf(sxs, 0.25), tq3 = quantileOf(sxs, 0.75);
    const oq1 = quantileOf(sys, 0.25), oq3 = quantileOf(sys, 0.75);
    const slope = (oq3 - oq1) / (tq3 - tq1 || 1);
    const at = (x: number) => oq1 + slope * (x - tq1);
    line = { x1: sx(xLo), y1: sy(at(xLo)), x2: sx(xHi), y2: sy(at(xHi)) };
    maxGap = Math.max(...points.map((p) => Math.abs(p.observed - at(p.theoretical))));
  }
  return {
    width, height, plot, line, maxGap,
    dots: points.map((p) => ({ cx: sx(p.theoretical), cy: sy(p.observed) })),
    xTicks: ticks(xLo, xHi).map((v) => ({ at: sx(v), label: String(Number(v.toFixed(2))) })),
    yTicks: ticks(y0, y1).map((v) => ({ at: sy(v), label: String(Number(v.toPrecision(3))) })),
  };
}
