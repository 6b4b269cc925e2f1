/**
 * Which section each profile path of the generated frame uses. Rolled sections come from the project's catalogue (so a
 * name-only outline resolves to the same dimensions as the parametric profile); welded girders and the secondary
 * tube/angle braces are invented for the scenario.
 */
import { findSection, toSectionInput } from '../../server/catalogue/catalogue';
import type { ISectionInput } from '../../server/engine/section';
import { MM_PER_IN } from '../../server/engine/units';

export interface ISectionSpec {
  kind: 'i';
  /** Name written into the IFC file: spellings vary on purpose ('IPE400', 'HE 300 B', 'W24x62'). */
  name: string;
  input: ISectionInput;
}

export interface TubeSpec {
  kind: 'tube';
  name: string;
  radius_mm: number;
  wall_mm: number;
}

export interface AngleSpec {
  kind: 'angle';
  name: string;
  leg_mm: number;
  thickness_mm: number;
  fillet_mm: number;
}

export type SectionSpec = ISectionSpec | TubeSpec | AngleSpec;

export interface FrameSections {
  /** Columns alternate between these two. */
  columns: [ISectionSpec, ISectionSpec];
  rolledBeam: ISectionSpec;
  profileSetBeam: ISectionSpec;
  mappedBeam: ISectionSpec;
  clippedBeam: ISectionSpec;
  outlineBeam: ISectionSpec;
  extrusionOnlyBeam: ISectionSpec;
  asymmetricGirder: ISectionSpec;
  weldedGirder: ISectionSpec;
  /** By schema: IFC2X3 has no FlangeSlope/FlangeEdgeRadius, so the metric tapered-flange beam is IFC4 and later only. */
  secondaryBeam: { ifc4: ISectionSpec; ifc2x3: ISectionSpec };
  tube: TubeSpec;
  angle: AngleSpec;
}

function rolled(name: string): ISectionSpec {
  const section = findSection(name);
  if (!section) throw new Error(`the generator needs '${name}' in the section catalogue`);
  return { kind: 'i', name, input: toSectionInput(section) };
}

function welded(name: string, depth_mm: number, web_mm: number, top: [number, number], bottom: [number, number]): ISectionSpec {
  return {
    kind: 'i',
    name,
    input: {
      depth_mm,
      webThickness_mm: web_mm,
      topFlange: { width_mm: top[0], thickness_mm: top[1], filletRadius_mm: 0 },
      bottomFlange: { width_mm: bottom[0], thickness_mm: bottom[1], filletRadius_mm: 0 },
      fabrication: 'welded',
    },
  };
}

const inches = (value_in: number): number => value_in * MM_PER_IN;

/** Sections of the metric variant (EN sections). */
export function metricSections(): FrameSections {
  return {
    columns: [rolled('HE 300 B'), rolled('HEA300')],
    rolledBeam: rolled('IPE400'),
    profileSetBeam: rolled('IPE 360'),
    mappedBeam: rolled('IPE 300'),
    clippedBeam: rolled('IPE 400'),
    outlineBeam: rolled('HE 240 A'),
    extrusionOnlyBeam: rolled('IPE 450'),
    asymmetricGirder: welded('WG900', 900, 12, [300, 20], [400, 25]),
    weldedGirder: welded('PG600x250', 600, 10, [250, 16], [250, 16]),
    secondaryBeam: {
      // An invented tapered-flange beam (8 % flange slope, toe radius) to exercise FlangeSlope and FlangeEdgeRadius.
      ifc4: {
        kind: 'i',
        name: 'TB400',
        input: {
          depth_mm: 400,
          webThickness_mm: 14,
          topFlange: { width_mm: 160, thickness_mm: 21, filletRadius_mm: 14, edgeRadius_mm: 8, slope_rad: Math.atan(0.08) },
          bottomFlange: { width_mm: 160, thickness_mm: 21, filletRadius_mm: 14, edgeRadius_mm: 8, slope_rad: Math.atan(0.08) },
          fabrication: 'rolled',
        },
      },
      ifc2x3: rolled('IPE 500'),
    },
    tube: { kind: 'tube', name: 'CHS 168.3x8', radius_mm: 84.15, wall_mm: 8 },
    angle: { kind: 'angle', name: 'L100x100x10', leg_mm: 100, thickness_mm: 10, fillet_mm: 12 },
  };
}

/** Sections of the imperial variant (W-shapes, girders in whole inches). */
export function imperialSections(): FrameSections {
  return {
    columns: [rolled('W24X146'), rolled('W21x122')],
    rolledBeam: rolled('W24x62'),
    profileSetBeam: rolled('W24X55'),
    mappedBeam: rolled('W21X93'),
    clippedBeam: rolled('W24X62'),
    outlineBeam: rolled('W27X84'),
    extrusionOnlyBeam: rolled('W30X90'),
    asymmetricGirder: welded('WG36', inches(36), inches(0.5), [inches(12), inches(0.75)], [inches(16), inches(1)]),
    weldedGirder: welded('PG24x10', inches(24), inches(0.375), [inches(10), inches(0.625)], [inches(10), inches(0.625)]),
    secondaryBeam: { ifc4: rolled('W24X76'), ifc2x3: rolled('W24X76') },
    tube: { kind: 'tube', name: 'HSS6.625x0.280', radius_mm: inches(6.625) / 2, wall_mm: inches(0.28) },
    angle: { kind: 'angle', name: 'L4x4x3/8', leg_mm: inches(4), thickness_mm: inches(0.375), fillet_mm: inches(0.375) },
  };
}
