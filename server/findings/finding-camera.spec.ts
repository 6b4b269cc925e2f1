import { MEMBER_IDS } from '../../test/fixtures/bcf/sample-findings';
import { framingCamera } from './bcf/bcf-camera';
import { axisBoxes, cameraFor, viewpointWithCamera } from './finding-camera';

// Axes of an invented two-beam bay, in millimetres as the IFC reader writes them.
const records = [
  { globalId: MEMBER_IDS.beamB12, axis: { start_mm: [6000, 0, 3500] as [number, number, number], end_mm: [0, 0, 3500] as [number, number, number] } },
  { globalId: MEMBER_IDS.beamB14, axis: { start_mm: [0, 8000, 3500] as [number, number, number], end_mm: [6000, 8000, 3000] as [number, number, number] } },
  { globalId: MEMBER_IDS.columnC3, axis: null },
];

describe('finding cameras', () => {
  const boxes = axisBoxes(records);

  it('turns each axis into a box in metres, whichever way the member runs', () => {
    expect(boxes.get(MEMBER_IDS.beamB12)).toEqual({ min_m: [0, 0, 3.5], max_m: [6, 0, 3.5] });
    expect(boxes.get(MEMBER_IDS.beamB14)).toEqual({ min_m: [0, 8, 3], max_m: [6, 8, 3.5] });
    expect(boxes.has(MEMBER_IDS.columnC3)).toBe(false);
  });

  it('frames the finding’s own members, else the whole model, else the origin', () => {
    expect(cameraFor([MEMBER_IDS.beamB12], boxes)).toEqual(framingCamera({ min_m: [0, 0, 3.5], max_m: [6, 0, 3.5] }));
    expect(cameraFor([MEMBER_IDS.columnC3], boxes)).toEqual(framingCamera({ min_m: [0, 0, 3], max_m: [6, 8, 3.5] }));
    expect(cameraFor([MEMBER_IDS.columnC3], new Map())).toEqual(framingCamera({ min_m: [0, 0, 0], max_m: [0, 0, 0] }));
  });

  it('keeps a viewpoint’s own camera and adds one only where it is missing', () => {
    const own = viewpointWithCamera([MEMBER_IDS.beamB12], undefined, boxes);
    expect(own).toEqual({ selectedGlobalIds: [MEMBER_IDS.beamB12], visibility: { defaultVisible: true, exceptionGlobalIds: [] }, camera: cameraFor([MEMBER_IDS.beamB12], boxes) });
    const camera = framingCamera({ min_m: [1, 1, 1], max_m: [2, 2, 2] });
    const given = { selectedGlobalIds: [], visibility: { defaultVisible: false, exceptionGlobalIds: [MEMBER_IDS.beamB14] }, camera };
    expect(viewpointWithCamera([MEMBER_IDS.beamB12], given, boxes)).toBe(given);
  });
});
