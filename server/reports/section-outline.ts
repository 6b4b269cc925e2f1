/**
 * The section outline and drawing scale for the calculation sheet. The outline is traced from the engine's exact
 * width function b(y), so root fillets, toe radii and tapered flanges appear as the check saw them.
 */
import type { SectionProperties } from '../engine/section-properties';

export interface OutlinePoint {
  x_mm: number;
  y_mm: number;
}

/** Points per band: enough for a fillet arc to look round at print size. */
const SUBDIVISIONS = 12;

/**
 * Closed outline, x from the web axis, y up from the underside: up the right-hand side (taking both widths at every
 * level where the width jumps), then down the left-hand side.
 */
export function sectionOutline_mm(props: SectionProperties): OutlinePoint[] {
  const levels = props.levels_mm;
  const right: OutlinePoint[] = [];
  for (let band = 0; band < levels.length - 1; band++) {
    const from = levels[band];
    const to = levels[band + 1];
    for (let k = 0; k <= SUBDIVISIONS; k++) {
      const y_mm = from + ((to - from) * k) / SUBDIVISIONS;
      // The first point of a band takes the width just above its lower limit, the last just below its upper one.
      const x_mm = props.widthAt_mm(y_mm, k === SUBDIVISIONS ? 'below' : 'above') / 2;
      const last = right[right.length - 1];
      if (!last || Math.abs(last.x_mm - x_mm) > 1e-9 || Math.abs(last.y_mm - y_mm) > 1e-9) right.push({ x_mm, y_mm });
    }
  }
  const left = right.map((point) => ({ x_mm: -point.x_mm, y_mm: point.y_mm })).reverse();
  return [...right, ...left];
}

/** Scales a drawing office uses (1:n). */
const DRAWING_SCALES = [1, 2, 2.5, 5, 10, 20, 25, 50, 100] as const;

export const PT_PER_MM = 72 / 25.4;

/** The largest standard scale 1:n at which a width × height drawing fits the box; the coarsest if none does. */
export function drawingScale(width_mm: number, height_mm: number, boxWidth_pt: number, boxHeight_pt: number): number {
  const fits = (n: number): boolean => (width_mm * PT_PER_MM) / n <= boxWidth_pt && (height_mm * PT_PER_MM) / n <= boxHeight_pt;
  return DRAWING_SCALES.find(fits) ?? DRAWING_SCALES[DRAWING_SCALES.length - 1];
}

/** Round tick values from 0 to at least `max` (1, 2 or 5 × 10^k steps), about `count` of them. */
export function niceTicks(max: number, count = 5): number[] {
  if (!(max > 0)) return [0];
  const rough = max / count;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((m) => m * power).find((candidate) => candidate >= rough) ?? 10 * power;
  const ticks: number[] = [];
  for (let value = 0; value < max + step * 0.999; value += step) ticks.push(Number(value.toPrecision(12)));
  return ticks;
}
