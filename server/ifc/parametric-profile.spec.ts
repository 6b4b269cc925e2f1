/** Parametric families by attribute position (IFC4 entity definitions, as spelt by web-ifc's ifc-schema.d.ts). */
import { IFCISHAPEPROFILEDEF, IFCLSHAPEPROFILEDEF, IFCRECTANGLEHOLLOWPROFILEDEF } from 'web-ifc';
import { isParametricFamily, parametricDimensions } from './parametric-profile';

/** Attribute values by position, as the reader passes them (positions 0–2 are ProfileType, ProfileName, Position). */
const at = (values: (number | undefined)[]) => (position: number) => values[position - 3];

describe('parametricDimensions', () => {
  it('leaves I-shapes to the I-section reader', () => {
    expect(isParametricFamily(IFCISHAPEPROFILEDEF)).toBe(false);
    expect(isParametricFamily(IFCLSHAPEPROFILEDEF)).toBe(true);
  });

  it('reads an unequal angle: Depth, Width, Thickness, FilletRadius, EdgeRadius, LegSlope (invented values)', () => {
    expect(parametricDimensions(IFCLSHAPEPROFILEDEF, at([150, 90, 10, 12, undefined, 0]), at([]))).toEqual({
      dimensions: { family: 'angle', depth_mm: 150, width_mm: 90, thickness_mm: 10, rootRadius_mm: 12 },
    });
  });

  it('names every missing or non-positive required attribute', () => {
    expect(parametricDimensions(IFCRECTANGLEHOLLOWPROFILEDEF, at([0, 200]), at([]))).toEqual({ problem: 'has no XDim, WallThickness' });
    expect(parametricDimensions(IFCLSHAPEPROFILEDEF, at([100, 100, 100]), at([]))).toEqual({
      problem: 'cannot be built: Thickness 100 mm is not less than the Depth 100 mm',
    });
  });
});
