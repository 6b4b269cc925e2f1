import { axis2Placement, determinant3, dot, identity, multiply, normalMatrix, transformDirection, transformPoint, transformationOperator, type Vec3 } from './matrix4';

const close = (actual: number[], expected: number[]): void => actual.forEach((v, i) => expect(v).toBeCloseTo(expected[i], 12));

describe('axis2Placement (ISO 16739 IfcAxis2Placement3D)', () => {
  it('defaults to the world axes', () => {
    expect(Array.from(axis2Placement([0, 0, 0]))).toEqual(Array.from(identity()));
  });

  it('makes RefDirection orthogonal to Axis and derives Y = Z × X', () => {
    const m = axis2Placement([1, 2, 3], [0, 0, 2], [1, 1, 5]);
    close(transformDirection(m, [1, 0, 0]), [Math.SQRT1_2, Math.SQRT1_2, 0]);
    close(transformDirection(m, [0, 1, 0]), [-Math.SQRT1_2, Math.SQRT1_2, 0]);
    close(transformPoint(m, [0, 0, 0]), [1, 2, 3]);
  });

  it('places a beam along its axis: local Z = (0,1,0), X = (−1,0,0) as in the buildingSMART sample #212', () => {
    const m = axis2Placement([0, 0, 0], [0, 1, 0], [-1, 0, 0]);
    close(transformPoint(m, [0, 0, 1000]), [0, 1000, 0]);
    close(transformDirection(m, [0, 1, 0]), [0, 0, 1]);
  });
});

describe('transformationOperator (IfcCartesianTransformationOperator3D)', () => {
  it('keeps the sense of Axis2, so a mirroring operator has a negative determinant', () => {
    expect(determinant3(transformationOperator([0, 0, 0]))).toBeCloseTo(1, 12);
    expect(determinant3(transformationOperator([0, 0, 0], [1, 0, 0], [0, -1, 0], [0, 0, 1]))).toBeCloseTo(-1, 12);
  });

  it('scales per axis', () => {
    const m = transformationOperator([5, 0, 0], undefined, undefined, undefined, [2, 3, 4]);
    close(transformPoint(m, [1, 1, 1]), [7, 3, 4]);
  });
});

describe('normalMatrix', () => {
  it('keeps normals perpendicular to surfaces under a non-uniform scale', () => {
    const m = multiply(transformationOperator([0, 0, 0], undefined, undefined, undefined, [1, 4, 1]), axis2Placement([0, 0, 0], [0, 0, 1], [1, 1, 0]));
    const tangent: Vec3 = [1, -1, 0];
    const normal: Vec3 = [1, 1, 0];
    const n = normalMatrix(m);
    const movedNormal: Vec3 = [n[0] * normal[0] + n[3] * normal[1] + n[6] * normal[2], n[1] * normal[0] + n[4] * normal[1] + n[7] * normal[2], n[2] * normal[0] + n[5] * normal[1] + n[8] * normal[2]];
    expect(dot(movedNormal, transformDirection(m, tangent))).toBeCloseTo(0, 12);
  });
});
