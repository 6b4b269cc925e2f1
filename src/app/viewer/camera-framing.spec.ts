import { STANDARD_VIEWS, fitDistance_m, fitHeight_m } from './camera-framing';
import { dot, length } from './ifc-axes';

describe('standard views', () => {
  it('have unit directions and up vectors square to them', () => {
    for (const view of Object.values(STANDARD_VIEWS)) {
      expect(Math.abs(length(view.direction) - 1)).toBeLessThan(1e-12);
      expect(Math.abs(length(view.up) - 1)).toBeLessThan(1e-12);
      expect(Math.abs(dot(view.direction, view.up))).toBeLessThan(1e-12);
    }
  });

  it('look down in plan and level in elevation', () => {
    expect(STANDARD_VIEWS.plan.direction).toEqual([0, 0, -1]);
    expect(STANDARD_VIEWS.front.direction[2]).toBe(0);
    expect(STANDARD_VIEWS.iso.up[2]).toBeGreaterThan(0);
  });
});

describe('framing a sphere', () => {
  // Sphere tangent to the view cone: d = r / sin(half-angle) (common practice, no source).
  it('stands √2·r away with a 90° square view', () => {
    expect(Math.abs(fitDistance_m(10, 90, 1) - 10 * Math.SQRT2)).toBeLessThan(1e-9);
  });

  it('uses the horizontal angle when the view is taller than wide', () => {
    // Half-angle 45° vertically; horizontally atan(tan 45° · 0.5) = 26.565°, sin = 1/√5.
    expect(Math.abs(fitDistance_m(10, 90, 0.5) - 10 * Math.sqrt(5))).toBeLessThan(1e-9);
  });

  it('needs a visible height of the diameter, more when the view is narrow', () => {
    expect(fitHeight_m(5, 16 / 9)).toBe(10);
    expect(fitHeight_m(5, 0.5)).toBe(20);
  });
});
