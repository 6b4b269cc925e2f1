import { type Vec3, ifcToThreeDirection, readModelOffset, threeToIfcDirection } from './ifc-axes';
import { ElementVisibility } from './element-visibility';
import {
  type CameraPose,
  ViewpointError,
  ifcCameraToPose,
  poseToIfcCamera,
  sectionPlaneFromIfc,
  sectionPlaneToIfc,
  visibilityOf,
} from './viewpoint';

function expectVec3(actual: Vec3, expected: Vec3, tolerance = 1e-12): void {
  actual.forEach((value, i) => {
    if (Math.abs(value - expected[i]) > tolerance) {
      throw new Error(`component ${i}: got [${actual.join(', ')}], expected [${expected.join(', ')}] ± ${tolerance}`);
    }
  });
}

// Invented site offset, of the size georeferenced models carry.
const OFFSET: Vec3 = [512_300, 6_170_450, 12.5];

describe('IFC ↔ three.js axes', () => {
  // glTF 2.0 §3.4: right-handed, +Y up (Khronos specification). IFC models are Z up (common practice, no source).
  it('turns IFC up (+Z) into glTF up (+Y) and IFC north (+Y) into glTF −Z', () => {
    expectVec3(ifcToThreeDirection([0, 0, 1]), [0, 1, 0]);
    expectVec3(ifcToThreeDirection([0, 1, 0]), [0, 0, -1]);
    expectVec3(ifcToThreeDirection([1, 0, 0]), [1, 0, 0]);
  });

  it('keeps the frame right-handed: x × y = z in both', () => {
    const [x, y] = [ifcToThreeDirection([1, 0, 0]), ifcToThreeDirection([0, 1, 0])];
    const cross: Vec3 = [x[1] * y[2] - x[2] * y[1], x[2] * y[0] - x[0] * y[2], x[0] * y[1] - x[1] * y[0]];
    expectVec3(cross, ifcToThreeDirection([0, 0, 1]));
  });

  it('round-trips directions', () => {
    const v: Vec3 = [0.3, -0.4, 0.866];
    expectVec3(threeToIfcDirection(ifcToThreeDirection(v)), v);
  });

  it('reads the model offset from the scene extras', () => {
    expect(readModelOffset({ modelOffset_m: [1, 2, 3] })).toEqual([1, 2, 3]);
    expect(readModelOffset(undefined)).toEqual([0, 0, 0]);
    expect(readModelOffset({})).toEqual([0, 0, 0]);
    expect(() => readModelOffset({ modelOffset_m: [1, 'x', 3] })).toThrow('three finite numbers');
  });
});

describe('cameras', () => {
  const planView: CameraPose = {
    kind: 'perspective',
    position: [10, 40, -20],
    direction: [0, -1, 0],
    up: [0, 0, -1],
    fieldOfView_deg: 50,
    aspectRatio: 16 / 9,
  };

  it('writes a camera looking straight down as IFC −Z with north up, offset added', () => {
    const camera = poseToIfcCamera(planView, OFFSET);
    expectVec3(camera.direction, [0, 0, -1]);
    expectVec3(camera.up, [0, 1, 0]);
    expectVec3(camera.viewPoint_m, [512_310, 6_170_470, 52.5]);
    expect(camera).toMatchObject({ kind: 'perspective', fieldOfView_deg: 50, aspectRatio: 16 / 9 });
  });

  it('round-trips a camera through IFC axes', () => {
    const pose = ifcCameraToPose(poseToIfcCamera(planView, OFFSET), OFFSET);
    expectVec3(pose.position, planView.position, 1e-6);
    expectVec3(pose.direction, planView.direction);
    expectVec3(pose.up, planView.up);
  });

  it('normalises directions that arrive with another length', () => {
    const pose = ifcCameraToPose(
      {
        kind: 'orthogonal',
        viewPoint_m: OFFSET,
        direction: [0, 0, -3],
        up: [0, 2, 0],
        viewToWorldScale_m: 30,
        aspectRatio: 1,
      },
      OFFSET,
    );
    expectVec3(pose.direction, [0, -1, 0]);
    expect(pose).toMatchObject({ kind: 'orthogonal', viewToWorldScale_m: 30 });
  });

  it('refuses cameras that cannot be placed, with a message that says why', () => {
    const base = poseToIfcCamera(planView, OFFSET);
    expect(() => ifcCameraToPose({ ...base, direction: [0, 0, 0] }, OFFSET)).toThrow(ViewpointError);
    expect(() => ifcCameraToPose({ ...base, direction: [0, 0, 0] }, OFFSET)).toThrow('direction has zero length');
    expect(() => ifcCameraToPose({ ...base, viewPoint_m: [Number.NaN, 0, 0] }, OFFSET)).toThrow('finite');
    // visinfo.xsd (BCF 3.0): FieldOfView is an exclusive range (0, 180).
    const straightAngle = { ...base, kind: 'perspective' as const, fieldOfView_deg: 180 };
    expect(() => ifcCameraToPose(straightAngle, OFFSET)).toThrow('0° and 180°');
    expect(() => ifcCameraToPose({ ...base, aspectRatio: 0 }, OFFSET)).toThrow('aspect ratio');
  });
});

describe('section planes', () => {
  // BCF: the clipping plane's direction points to the side that is cut away (BCF-XML documentation, from memory).
  it('writes a horizontal cut that keeps the storey below as direction +Z at the cut height', () => {
    const cutHeight_m = 3.5;
    const threeY = cutHeight_m - OFFSET[2];
    const plane = sectionPlaneToIfc({ normal: [0, -1, 0], constant: threeY }, [4, 0, -6], OFFSET);
    expectVec3(plane.direction, [0, 0, 1]);
    expectVec3(plane.location_m, [OFFSET[0] + 4, OFFSET[1] + 6, cutHeight_m], 1e-6);
  });

  it('round-trips a plane and keeps the same side', () => {
    const plane = sectionPlaneFromIfc({ location_m: [OFFSET[0], OFFSET[1], 3.5], direction: [0, 0, 1] }, OFFSET);
    const [nx, ny, nz] = plane.normal;
    const keeps = (p: Vec3) => nx * p[0] + ny * p[1] + nz * p[2] + plane.constant >= 0;
    expect(keeps([0, 3.5 - OFFSET[2] - 1, 0])).toBe(true);
    expect(keeps([0, 3.5 - OFFSET[2] + 1, 0])).toBe(false);
  });
});

describe('visibility', () => {
  const ids = ['a', 'b', 'c', 'd', 'e'];

  it('lists the hidden elements when most are visible, and the visible ones otherwise', () => {
    expect(visibilityOf(ids, (id) => id !== 'c')).toEqual({ defaultVisible: true, exceptionGlobalIds: ['c'] });
    expect(visibilityOf(ids, (id) => id === 'a')).toEqual({ defaultVisible: false, exceptionGlobalIds: ['a'] });
  });

  it('restores the same elements from both forms', () => {
    for (const visible of [(id: string) => id !== 'c', (id: string) => id === 'a' || id === 'b']) {
      const { defaultVisible, exceptionGlobalIds } = visibilityOf(ids, visible);
      const restored = new ElementVisibility();
      restored.restore(defaultVisible, exceptionGlobalIds);
      expect(ids.filter((id) => restored.isShown(id, false))).toEqual(ids.filter(visible));
    }
  });
});
