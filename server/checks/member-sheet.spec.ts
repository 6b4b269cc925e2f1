import type { IDimensions } from '../engine/section-family';
import type { MemberRecord } from '../ifc/model-read-result';
import { sectionNoteOf } from './member-sheet';

// An invented haunched rafter (demo scenario): 600 deep at the start, 400 at the end, same plates.
const plate = { width_mm: 180, thickness_mm: 13.5, filletRadius_mm: 21 };
const at = (depth_mm: number): IDimensions => ({ family: 'I', depth_mm, webThickness_mm: 8.6, topFlange: plate, bottomFlange: plate });

function member(profile: MemberRecord['profile']): MemberRecord {
  return {
    globalId: '2VgK4vDz5FvQK0bE0RAFTR',
    expressId: 1,
    ifcClass: 'IfcBeam',
    name: 'R1',
    tag: 'R1',
    objectType: null,
    predefinedType: null,
    storey: null,
    material: null,
    length_mm: 12000,
    axis: null,
    status: 'ok',
    profile,
    section: null,
    flags: [],
  };
}

describe('sectionNoteOf', () => {
  it('says how the section was found', () => {
    expect(sectionNoteOf(member({ ...at(600), name: 'R', source: 'body-cut', ifcType: 'IfcFacetedBrep', fabrication: 'welded' }))).toBe(
      'Section measured from a cut through the body.',
    );
    expect(sectionNoteOf(member(null))).toBeNull();
  });

  it('lists a tapered member’s sections and says the smaller one is checked', () => {
    const note = sectionNoteOf(
      member({
        ...at(400),
        name: 'R',
        source: 'ifc-profile',
        ifcType: 'IfcIShapeProfileDef',
        fabrication: 'welded',
        along: [
          { at: 0, dimensions: at(600) },
          { at: 1, dimensions: at(400) },
        ],
        governingAt: 1,
      }),
    );
    expect(note).toContain('at 0 % of the length: d 600, tw 8.6, flanges 180×13.5 mm');
    expect(note).toContain('at 100 % of the length: d 400');
    expect(note).toContain('Checked with the smaller section, at 100 % of the length');
  });
});
