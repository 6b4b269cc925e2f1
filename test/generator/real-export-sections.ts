/**
 * The member paths that imitate how real exports give a section (outlines with arcs and voids, parametric profiles of
 * every family, bodies only, tapered members), the section each one writes, and what a reader should find for it.
 *
 * Dimensions of named sections (mm), from memory of the published tables, to be verified against a current table:
 * - EN 10365:2017 (also in server/catalogue/en-sections.ts): HE 360 A h 350, b 300, tw 10, tf 17.5, r 27; IPE 270 h 270,
 *   b 135, tw 6.6, tf 10.2, r 15; IPE 400 h 400, b 180, tw 8.6, tf 13.5, r 21; UPE 200 h 200, b 80, tw 6.0, tf 11.0, r 13.
 * - EN 10056-1: L 150x90x10 r1 12.
 * - AS/NZS 3679.1 (hot-rolled): 310UC96.8 d 308, bf 305, tf 15.4, tw 9.9, r1 16.5; 300PFC40.1 d 300, bf 90, tf 16.0,
 *   tw 8.0, r1 15; 150PFC17.7 d 150, bf 75, tf 9.5, tw 6.0, r1 10.
 * - AS/NZS 1163 (cold-formed hollow): 100x100x6.0 SHS, outside corner radius 2.5 t = 15 for t > 3 mm, inside r = 9.
 * - EN 10219-2 (cold-formed hollow): RHS 200x100x8 outside corner radius 2.5 t = 20 for 6 < t ≤ 10 mm, inside 1.5 t = 12;
 *   CHS 219.1x6.3 (dimensions in the name).
 * Invented for the demo scenario (no table): the lipped channel's inside radius (1.5 t, common practice, no source), the
 * Z purlin, the welded box girder 'PL-GIRDER-7', the haunched rafter and the tapered column.
 */
import type {
  AngleDimensions,
  BoxDimensions,
  ChannelDimensions,
  IDimensions,
  SectionDimensions,
  TeeDimensions,
} from '../../server/engine/section-family';
import type { FrameSchema } from './frame-writer';
import type { DrawableSection } from './section-loops';

/** How a member of the path writes its section and body. */
export type RealExportPath =
  // Outlines (IfcArbitraryClosedProfileDef / IfcArbitraryProfileDefWithVoids), extruded.
  | 'outline-arcs-by-parameter'
  | 'outline-arcs-by-point'
  | 'outline-indexed-arcs'
  | 'outline-polyline'
  | 'outline-welded-box'
  | 'outline-rounded-rhs'
  // Parametric profiles of the other families, extruded.
  | 'ushape'
  | 'tshape'
  | 'lshape'
  | 'cshape'
  | 'zshape'
  | 'rectangle-hollow'
  | 'circle-hollow'
  | 'rectangle'
  // Bodies only: no profile, no extrusion.
  | 'brep-i'
  | 'brep-channel'
  | 'brep-box'
  | 'brep-i-coped'
  | 'polygonal-i'
  | 'polygonal-channel'
  | 'polygonal-box'
  | 'triangulated-i'
  | 'triangulated-channel'
  | 'triangulated-box'
  // IfcExtrudedAreaSolidTapered between two IfcIShapeProfileDef.
  | 'tapered-rafter'
  | 'tapered-column';

/** How a reader is expected to find the section (member `profile.source`). */
export type SectionFoundBy = 'ifc-profile' | 'outline' | 'body-cut' | 'catalogue';

/** Where the file names the section; `null`: nowhere. */
export type DesignationPlace = 'ProfileName' | 'ObjectType' | 'Name' | null;

export type CurveStyle = 'composite-by-parameter' | 'composite-by-point' | 'indexed' | 'polyline';
export type BodyKind = 'faceted-brep' | 'polygonal-face-set' | 'triangulated-face-set';

/** What the generator writes for a path. */
export type PathWriting =
  | { kind: 'outline'; curve: CurveStyle; section: DrawableSection }
  | { kind: 'parametric'; entity: string; section: DrawableSection }
  | { kind: 'body'; body: BodyKind; section: DrawableSection; cope?: { length_mm: number; depth_mm: number } }
  | { kind: 'tapered'; start: IDimensions; end: IDimensions; endDesignation: string };

export interface RealExportSection {
  /** The designation as the file spells it, or null when the file gives none. */
  designation: string | null;
  designationIn: DesignationPlace;
  /** The IFC entity that carries the section (the profile, or the body item). */
  ifcType: string;
  /** Paths using IFC4 entities are left out of IFC2X3 models. */
  ifc4Only: boolean;
  /** Columns stand; every other path is written on beams. */
  role: 'beam' | 'column';
  writing: PathWriting;
  /** What a reader should find. */
  expected: {
    foundBy: SectionFoundBy;
    /** At the start of the member for a tapered one. */
    dimensions: SectionDimensions;
    /** Tapered members: the section at the end. */
    endDimensions?: SectionDimensions;
  };
}

function rolledI(depth_mm: number, width_mm: number, web_mm: number, flange_mm: number, fillet_mm: number): IDimensions {
  const flange = { width_mm, thickness_mm: flange_mm, filletRadius_mm: fillet_mm };
  return { family: 'I', depth_mm, webThickness_mm: web_mm, topFlange: flange, bottomFlange: { ...flange } };
}

function channel(depth_mm: number, width_mm: number, web_mm: number, flange_mm: number, root_mm: number): ChannelDimensions {
  return { family: 'channel', depth_mm, width_mm, webThickness_mm: web_mm, flangeThickness_mm: flange_mm, rootRadius_mm: root_mm };
}

function box(depth_mm: number, width_mm: number, wall_mm: number, outer_mm: number, inner_mm: number, flange_mm = wall_mm): BoxDimensions {
  return { family: 'box', depth_mm, width_mm, webThickness_mm: wall_mm, flangeThickness_mm: flange_mm, outerCornerRadius_mm: outer_mm, innerCornerRadius_mm: inner_mm };
}

// Named sections (sources in the header comment).
const UC310_96_8 = rolledI(308, 305, 9.9, 15.4, 16.5);
const PFC300_40_1 = channel(300, 90, 8.0, 16.0, 15);
const PFC150_17_7 = channel(150, 75, 6.0, 9.5, 10);
const SHS100_6 = box(100, 100, 6.0, 15, 9);
const HEA360 = rolledI(350, 300, 10.0, 17.5, 27);
const IPE270 = rolledI(270, 135, 6.6, 10.2, 15);
const RHS200_100_8 = box(200, 100, 8, 20, 12);
const UPE200 = channel(200, 80, 6.0, 11.0, 13);
/** A tee split from an IPE 400 along its web: half the depth, the IPE's flange, web and root radius. */
const HALF_IPE400: TeeDimensions = { family: 'tee', depth_mm: 200, width_mm: 180, webThickness_mm: 8.6, flangeThickness_mm: 13.5, rootRadius_mm: 21 };
const L150_90_10: AngleDimensions = { family: 'angle', depth_mm: 150, width_mm: 90, thickness_mm: 10, rootRadius_mm: 12 };

// Invented for the demo (no table).
const LIPPED_C150: ChannelDimensions = { ...channel(150, 65, 2.0, 2.0, 3.0), lip_mm: 20 };
const WELDED_BOX_GIRDER = box(700, 400, 12, 0, 0, 20);
const RAFTER_AT_HAUNCH = rolledI(600, 180, 8.6, 13.5, 21);
const RAFTER_AT_SPAN = rolledI(400, 180, 8.6, 13.5, 21);
const COLUMN_BASE = rolledI(500, 250, 10, 16, 0);
const COLUMN_HEAD = rolledI(300, 250, 10, 16, 0);

const parametric = (designation: string, entity: string, section: DrawableSection, dimensions: SectionDimensions, ifc4Only = false): RealExportSection => ({
  designation,
  designationIn: 'ProfileName',
  ifcType: entity,
  ifc4Only,
  role: 'beam',
  writing: { kind: 'parametric', entity, section },
  expected: { foundBy: 'ifc-profile', dimensions },
});

const outline = (designation: string, curve: CurveStyle, section: SectionDimensions, withVoids = false): RealExportSection => ({
  designation,
  designationIn: 'ProfileName',
  ifcType: withVoids ? 'IfcArbitraryProfileDefWithVoids' : 'IfcArbitraryClosedProfileDef',
  ifc4Only: curve === 'indexed',
  role: 'beam',
  writing: { kind: 'outline', curve, section },
  expected: { foundBy: 'outline', dimensions: section },
});

const BODY_ENTITY: Record<BodyKind, string> = {
  'faceted-brep': 'IfcFacetedBrep',
  'polygonal-face-set': 'IfcPolygonalFaceSet',
  'triangulated-face-set': 'IfcTriangulatedFaceSet',
};

const body = (kind: BodyKind, section: SectionDimensions, designation: string | null, designationIn: DesignationPlace): RealExportSection => ({
  designation,
  designationIn,
  ifcType: BODY_ENTITY[kind],
  ifc4Only: kind !== 'faceted-brep',
  role: 'beam',
  writing: { kind: 'body', body: kind, section },
  expected: { foundBy: 'body-cut', dimensions: section },
});

/** `designation` names the start profile, `endDesignation` the end one. */
const tapered = (designation: string, endDesignation: string, role: 'beam' | 'column', start: IDimensions, end: IDimensions): RealExportSection => ({
  designation,
  designationIn: 'ProfileName',
  ifcType: 'IfcExtrudedAreaSolidTapered',
  ifc4Only: true,
  role,
  writing: { kind: 'tapered', start, end, endDesignation },
  expected: { foundBy: 'ifc-profile', dimensions: start, endDimensions: end },
});

/** Every real-export path with its section. A Z-section has no family of its own: it reads as 'other'. */
export const REAL_EXPORT_SECTIONS: Readonly<Record<RealExportPath, RealExportSection>> = {
  'outline-arcs-by-parameter': outline('310UC96.8', 'composite-by-parameter', UC310_96_8),
  // Traversed with some segments reversed (SameSense .F.), as some exporters write them.
  'outline-arcs-by-point': outline('300PFC40.1', 'composite-by-point', PFC300_40_1),
  'outline-indexed-arcs': outline('IPE 270', 'indexed', IPE270),
  // Root fillets as a few chords: the radius is approximate (4 chords a quarter circle).
  'outline-polyline': outline('150PFC17.7', 'polyline', PFC150_17_7),
  'outline-welded-box': outline('PL-GIRDER-7', 'polyline', WELDED_BOX_GIRDER, true),
  'outline-rounded-rhs': outline('100x6.0SHS', 'composite-by-parameter', SHS100_6, true),
  ushape: parametric('UPE 200', 'IfcUShapeProfileDef', UPE200, UPE200),
  tshape: parametric('1/2IPE400', 'IfcTShapeProfileDef', HALF_IPE400, HALF_IPE400),
  lshape: parametric('L150x90x10', 'IfcLShapeProfileDef', L150_90_10, L150_90_10),
  cshape: parametric('C150x65x20x2.0', 'IfcCShapeProfileDef', LIPPED_C150, LIPPED_C150),
  zshape: parametric(
    'Z200x75x2.5',
    'IfcZShapeProfileDef',
    { family: 'z', depth_mm: 200, flangeWidth_mm: 75, webThickness_mm: 2.5, flangeThickness_mm: 2.5, rootRadius_mm: 3.75 },
    { family: 'other', depth_mm: 200, width_mm: 147.5, description: 'Z-section' },
  ),
  'rectangle-hollow': parametric('RHS 200x100x8', 'IfcRectangleHollowProfileDef', RHS200_100_8, RHS200_100_8),
  'circle-hollow': parametric('CHS 219.1x6.3', 'IfcCircleHollowProfileDef', { family: 'tube', diameter_mm: 219.1, wallThickness_mm: 6.3 }, { family: 'tube', diameter_mm: 219.1, wallThickness_mm: 6.3 }),
  rectangle: parametric('FL 200x20', 'IfcRectangleProfileDef', { family: 'plate', depth_mm: 200, width_mm: 20 }, { family: 'plate', depth_mm: 200, width_mm: 20 }),
  // Root fillets and corners as 3 facets a quarter circle: radii read from a body are approximate.
  'brep-i': body('faceted-brep', HEA360, 'HEA360', 'ObjectType'),
  'brep-channel': body('faceted-brep', PFC300_40_1, '300PFC40.1', 'Name'),
  'brep-box': body('faceted-brep', RHS200_100_8, null, null),
  'brep-i-coped': {
    ...body('faceted-brep', IPE270, 'IPE 270', 'ObjectType'),
    writing: { kind: 'body', body: 'faceted-brep', section: IPE270, cope: { length_mm: 120, depth_mm: 40 } },
  },
  'polygonal-i': body('polygonal-face-set', IPE270, 'IPE 270', 'Name'),
  'polygonal-channel': body('polygonal-face-set', PFC150_17_7, '150PFC17.7', 'ObjectType'),
  'polygonal-box': body('polygonal-face-set', SHS100_6, null, null),
  'triangulated-i': body('triangulated-face-set', HEA360, 'HEA360', 'Name'),
  'triangulated-channel': body('triangulated-face-set', UPE200, 'UPE 200', 'ObjectType'),
  'triangulated-box': body('triangulated-face-set', RHS200_100_8, null, null),
  'tapered-rafter': tapered('IPE400-H600', 'IPE400', 'beam', RAFTER_AT_HAUNCH, RAFTER_AT_SPAN),
  'tapered-column': tapered('TC500', 'TC300', 'column', COLUMN_BASE, COLUMN_HEAD),
};

/** The real-export paths a model of this schema holds, in the order members are given them. */
export function realExportPaths(schema: FrameSchema, role: 'beam' | 'column'): RealExportPath[] {
  return (Object.keys(REAL_EXPORT_SECTIONS) as RealExportPath[]).filter((path) => {
    const section = REAL_EXPORT_SECTIONS[path];
    return section.role === role && !(schema === 'IFC2X3' && section.ifc4Only);
  });
}
