import { sectionDimensionsOf } from '../../../../server/ifc/model-read-result';
import { channelRecord, memberRecord, taperedRecord, tubeRecord } from '../models.testing';
import { dimensionRows, governingText, stationRows, stationText } from './section-dimension-rows';

const table = (rows: { label: string; value: string }[]) => Object.fromEntries(rows.map((r) => [r.label, r.value]));

describe('dimensionRows', () => {
  it('gives an I-section its depth, web and both flanges (IPE 200, EN 10365, from memory)', () => {
    expect(table(dimensionRows(sectionDimensionsOf(memberRecord().profile!)))).toEqual({
      Depth: '200 mm',
      'Web thickness': '5.6 mm',
      'Top flange': '100 × 8.5 mm, r 12 mm',
      'Bottom flange': '100 × 8.5 mm, r 12 mm',
    });
  });

  it("gives a channel its width, flanges, radii and flange slope in percent (UPN 200, EN 10365, from memory; UPN flanges slope 8 %, from memory)", () => {
    expect(table(dimensionRows(sectionDimensionsOf(channelRecord().profile!)))).toEqual({
      Depth: '200 mm',
      'Width, web included': '75 mm',
      'Web thickness': '8.5 mm',
      'Flange thickness': '11.5 mm',
      'Root radius': '11.5 mm',
      'Flange tip radius': '6 mm',
      'Flange slope': '8 %',
    });
  });

  it('gives a circular hollow section its diameter and wall (CHS 168.3 × 8.0, EN 10210-2, from memory)', () => {
    expect(table(dimensionRows(sectionDimensionsOf(tubeRecord().profile!)))).toEqual({ 'Outside diameter': '168.3 mm', 'Wall thickness': '8 mm' });
  });

  it('leaves out what the file did not give, and names the legs of an angle (L 100 × 100 × 10, EN 10056-1, from memory)', () => {
    expect(table(dimensionRows({ family: 'angle', depth_mm: 100, width_mm: 100, thickness_mm: 10, rootRadius_mm: 12 }))).toEqual({
      'Leg along the depth': '100 mm',
      'Leg along the width': '100 mm',
      Thickness: '10 mm',
      'Root radius': '12 mm',
    });
  });

  it('gives a box its walls and corners (RHS 200 × 100 × 8 hot-finished, corner radii 1.5 t and 1.0 t, EN 10210-2, from memory)', () => {
    const rhs = { family: 'box', depth_mm: 200, width_mm: 100, webThickness_mm: 8, flangeThickness_mm: 8, outerCornerRadius_mm: 12, innerCornerRadius_mm: 8 } as const;
    expect(table(dimensionRows(rhs))).toEqual({
      Depth: '200 mm',
      Width: '100 mm',
      'Side walls (webs)': '8 mm',
      'Top and bottom walls': '8 mm',
      'Outer corner radius': '12 mm',
      'Inner corner radius': '8 mm',
    });
  });

  it('gives any other shape its description and extent (invented sizes: only the wording is checked)', () => {
    expect(table(dimensionRows({ family: 'other', depth_mm: 200, width_mm: 150, description: 'Z-section' }))).toEqual({
      Shape: 'Z-section',
      'Overall depth': '200 mm',
      'Overall width': '150 mm',
    });
  });
});

describe('sections along a tapered member', () => {
  it('lists both ends and marks the smaller one as the one the checks use (IPE 400 to IPE 300, EN 10365, from memory)', () => {
    const profile = taperedRecord().profile!;
    expect(stationRows(profile)).toEqual([
      { at: '0 % (start)', dimensions: 'd 400, tw 8.6, flanges 180×13.5', governs: false },
      { at: '100 % (end)', dimensions: 'd 300, tw 7.1, flanges 150×10.7', governs: true },
    ]);
    expect(governingText(profile)).toBe('The checks use the smaller section, at the end; never a larger one.');
  });

  it('says nothing for a member of constant section, and places a station between the ends in percent', () => {
    expect(stationRows(memberRecord().profile!)).toEqual([]);
    expect(governingText(memberRecord().profile!)).toBeNull();
    expect(stationText(0.375)).toBe('38 %');
  });
});
