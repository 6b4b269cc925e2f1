/**
 * Writes sections and bodies as IFC entities: outline curves (IfcCompositeCurve of IfcPolyline and IfcTrimmedCurve
 * arcs, IfcIndexedPolyCurve with IfcArcIndex, plain IfcPolyline), parametric profiles of every family, and bodies given
 * only as faces (IfcFacetedBrep, IfcPolygonalFaceSet, IfcTriangulatedFaceSet). Attribute orders follow each schema as
 * web-ifc's ifc-schema.d.ts spells the constructors; IFC2X3 adds trailing centre-of-gravity attributes to some profiles.
 */
import type { CurveStyle, BodyKind } from './real-export-sections';
import { arcMidPoint, chordedLoop, type DrawableSection, type Loop, type Point2, type Segment, sectionLoops } from './section-loops';
import { type Mesh, triangulate } from './solid-mesh';
import { enumValue, FALSE, list, NULL, type StepValue, type StepWriter, text, TRUE, typed } from './step-writer';

/** What the section writer needs from the file it writes into. */
export interface SectionWriterContext {
  w: StepWriter;
  ifc2x3: boolean;
  /** A length in model units. */
  len(value_mm: number): StepValue;
  /** A plane angle in the model's angle unit. */
  angle(value_rad: number): StepValue;
  /** A profile's Position (required in IFC2X3). */
  profilePosition(): StepValue;
}

/** Chords a quarter circle gets where a curve is written as straight pieces. */
export const POLYLINE_CHORDS_PER_QUARTER = 4;

const TWO_PI = 2 * Math.PI;
const normalisedAngle = (a_rad: number): number => ((a_rad % TWO_PI) + TWO_PI) % TWO_PI;

export class SectionWriter {
  constructor(private readonly c: SectionWriterContext) {}

  private point2(p: Point2): StepValue {
    return this.c.w.add('IFCCARTESIANPOINT', list([this.c.len(p[0]), this.c.len(p[1])]));
  }

  private optionalLength(value_mm: number | undefined): StepValue {
    return value_mm ? this.c.len(value_mm) : NULL;
  }

  /** A closed IfcPolyline: the first point's entity repeated at the end. */
  private polyline(points: readonly Point2[]): StepValue {
    const refs = points.map((p) => this.point2(p));
    return this.c.w.add('IFCPOLYLINE', list([...refs, refs[0]]));
  }

  /**
   * An arc as an IfcTrimmedCurve on an IfcCircle, trimmed by angle parameters or by its end points. Written from
   * `from` to `to`; clockwise arcs have SenseAgreement .F. (the circle itself runs counter-clockwise).
   */
  private trimmedArc(s: Extract<Segment, { kind: 'arc' }>, byPoint: boolean, from = s.from, to = s.to, sweep_rad = s.sweep_rad): StepValue {
    const w = this.c.w;
    const circle = w.add('IFCCIRCLE', w.add('IFCAXIS2PLACEMENT2D', this.point2(s.centre), NULL), this.c.len(s.radius_mm));
    const angleOf = (p: Point2): number => normalisedAngle(Math.atan2(p[1] - s.centre[1], p[0] - s.centre[0]));
    const trim = (p: Point2): StepValue => (byPoint ? list([this.point2(p)]) : list([typed('IFCPARAMETERVALUE', this.c.angle(angleOf(p)))]));
    return w.add('IFCTRIMMEDCURVE', circle, trim(from), trim(to), sweep_rad > 0 ? TRUE : FALSE, enumValue(byPoint ? 'CARTESIAN' : 'PARAMETER'));
  }

  /**
   * IfcCompositeCurve: runs of straight segments as one IfcPolyline each, arcs as trimmed circles. With `reverseSome`,
   * every second piece is written backwards and marked SameSense .F., as some exporters do.
   */
  private compositeCurve(loop: Loop, byPoint: boolean, reverseSome: boolean): StepValue {
    const w = this.c.w;
    const pieces: Segment[][] = [];
    for (const s of loop) {
      const last = pieces[pieces.length - 1];
      if (s.kind === 'line' && last && last[0].kind === 'line') last.push(s);
      else pieces.push([s]);
    }
    const segments = pieces.map((piece, i) => {
      const reversed = reverseSome && i % 2 === 1;
      let curve: StepValue;
      if (piece[0].kind === 'arc') {
        const arc = piece[0];
        curve = reversed ? this.trimmedArc(arc, byPoint, arc.to, arc.from, -arc.sweep_rad) : this.trimmedArc(arc, byPoint);
      } else {
        const points = [piece[0].from, ...piece.map((s) => s.to)];
        curve = w.add('IFCPOLYLINE', list((reversed ? points.reverse() : points).map((p) => this.point2(p))));
      }
      return w.add('IFCCOMPOSITECURVESEGMENT', enumValue('CONTINUOUS'), reversed ? FALSE : TRUE, curve);
    });
    return w.add('IFCCOMPOSITECURVE', list(segments), FALSE);
  }

  /** IfcIndexedPolyCurve (IFC4): straight runs as IfcLineIndex, arcs as IfcArcIndex through their mid point. */
  private indexedCurve(loop: Loop): StepValue {
    const coordinates: Point2[] = [];
    const indexOf = (p: Point2): number => coordinates.push(p);
    const first = indexOf(loop[0].from);
    let current = first;
    const segments = loop.map((s, i) => {
      const end = i === loop.length - 1 ? first : indexOf(s.to);
      const indices = s.kind === 'arc' ? [current, indexOf(arcMidPoint(s)), end] : [current, end];
      current = end;
      return typed(s.kind === 'arc' ? 'IFCARCINDEX' : 'IFCLINEINDEX', list(indices.map(String)));
    });
    const points = this.c.w.add('IFCCARTESIANPOINTLIST2D', list(coordinates.map((p) => list([this.c.len(p[0]), this.c.len(p[1])]))));
    return this.c.w.add('IFCINDEXEDPOLYCURVE', points, list(segments), FALSE);
  }

  private curve(loop: Loop, style: CurveStyle): StepValue {
    switch (style) {
      case 'composite-by-parameter':
        return this.compositeCurve(loop, false, false);
      case 'composite-by-point':
        return this.compositeCurve(loop, true, true);
      case 'indexed':
        if (this.c.ifc2x3) throw new Error('IfcIndexedPolyCurve does not exist in IFC2X3');
        return this.indexedCurve(loop);
      case 'polyline':
        return this.polyline(chordedLoop(loop, POLYLINE_CHORDS_PER_QUARTER));
    }
  }

  /** IfcArbitraryClosedProfileDef, or IfcArbitraryProfileDefWithVoids when the section is hollow. */
  outline(name: string, section: DrawableSection, style: CurveStyle): StepValue {
    const loops = sectionLoops(section);
    const outer = this.curve(loops.outer, style);
    if (loops.voids.length === 0) return this.c.w.add('IFCARBITRARYCLOSEDPROFILEDEF', enumValue('AREA'), text(name), outer);
    const inner = loops.voids.map((loop) => this.curve(loop, style));
    return this.c.w.add('IFCARBITRARYPROFILEDEFWITHVOIDS', enumValue('AREA'), text(name), outer, list(inner));
  }

  /** The parametric profile of a section's family (I-shapes are written by the frame writer). */
  parametric(name: string, section: DrawableSection): StepValue {
    const { w, ifc2x3, len } = this.c;
    const head = [enumValue('AREA'), text(name), this.c.profilePosition()];
    const l = (v_mm: number): StepValue => len(v_mm);
    const o = (v_mm: number | undefined): StepValue => this.optionalLength(v_mm);
    const centreOfGravity = (count: number): StepValue[] => (ifc2x3 ? Array<StepValue>(count).fill(NULL) : []);
    switch (section.family) {
      case 'channel':
        if (section.lip_mm) {
          if (section.webThickness_mm !== section.flangeThickness_mm) throw new Error('a lipped channel has one wall thickness');
          return w.add('IFCCSHAPEPROFILEDEF', ...head, l(section.depth_mm), l(section.width_mm), l(section.webThickness_mm), l(section.lip_mm), o(section.rootRadius_mm), ...centreOfGravity(1));
        }
        return w.add('IFCUSHAPEPROFILEDEF', ...head, l(section.depth_mm), l(section.width_mm), l(section.webThickness_mm), l(section.flangeThickness_mm), o(section.rootRadius_mm), o(section.edgeRadius_mm), section.slope_rad ? this.c.angle(section.slope_rad) : NULL, ...centreOfGravity(1));
      case 'tee':
        return w.add('IFCTSHAPEPROFILEDEF', ...head, l(section.depth_mm), l(section.width_mm), l(section.webThickness_mm), l(section.flangeThickness_mm), o(section.rootRadius_mm), o(section.flangeEdgeRadius_mm), o(section.webEdgeRadius_mm), NULL, NULL, ...centreOfGravity(1));
      case 'angle':
        return w.add('IFCLSHAPEPROFILEDEF', ...head, l(section.depth_mm), l(section.width_mm), l(section.thickness_mm), o(section.rootRadius_mm), o(section.edgeRadius_mm), NULL, ...centreOfGravity(2));
      case 'z':
        return w.add('IFCZSHAPEPROFILEDEF', ...head, l(section.depth_mm), l(section.flangeWidth_mm), l(section.webThickness_mm), l(section.flangeThickness_mm), o(section.rootRadius_mm), NULL);
      case 'box':
        if (section.webThickness_mm !== section.flangeThickness_mm) throw new Error('IfcRectangleHollowProfileDef has one wall thickness');
        return w.add('IFCRECTANGLEHOLLOWPROFILEDEF', ...head, l(section.width_mm), l(section.depth_mm), l(section.webThickness_mm), o(section.innerCornerRadius_mm), o(section.outerCornerRadius_mm));
      case 'tube':
        return w.add('IFCCIRCLEHOLLOWPROFILEDEF', ...head, l(section.diameter_mm / 2), l(section.wallThickness_mm));
      case 'plate':
        return w.add('IFCRECTANGLEPROFILEDEF', ...head, l(section.width_mm), l(section.depth_mm));
      case 'I':
      case 'other':
        throw new Error(`no parametric profile is written here for family '${section.family}'`);
    }
  }

  private point3List(mesh: Mesh): StepValue {
    return this.c.w.add('IFCCARTESIANPOINTLIST3D', list(mesh.points.map((p) => list(p.map((v) => this.c.len(v))))));
  }

  /** A body given only by its faces, in the representation item the kind names. */
  body(kind: BodyKind, mesh: Mesh): StepValue {
    const w = this.c.w;
    const oneBased = (loop: readonly number[]): StepValue => list(loop.map((i) => String(i + 1)));
    switch (kind) {
      case 'faceted-brep': {
        const points = mesh.points.map((p) => w.add('IFCCARTESIANPOINT', list(p.map((v) => this.c.len(v)))));
        const bound = (type: string, loop: readonly number[]): StepValue => w.add(type, w.add('IFCPOLYLOOP', list(loop.map((i) => points[i]))), TRUE);
        const faces = mesh.faces.map((face) =>
          w.add('IFCFACE', list([bound('IFCFACEOUTERBOUND', face.outer), ...face.voids.map((loop) => bound('IFCFACEBOUND', loop))])),
        );
        return w.add('IFCFACETEDBREP', w.add('IFCCLOSEDSHELL', list(faces)));
      }
      case 'polygonal-face-set': {
        const faces = mesh.faces.map((face) =>
          face.voids.length === 0
            ? w.add('IFCINDEXEDPOLYGONALFACE', oneBased(face.outer))
            : w.add('IFCINDEXEDPOLYGONALFACEWITHVOIDS', oneBased(face.outer), list(face.voids.map(oneBased))),
        );
        return w.add('IFCPOLYGONALFACESET', this.point3List(mesh), TRUE, list(faces), NULL);
      }
      case 'triangulated-face-set':
        return w.add('IFCTRIANGULATEDFACESET', this.point3List(mesh), NULL, TRUE, list(triangulate(mesh).map(oneBased)), NULL);
    }
  }
}
