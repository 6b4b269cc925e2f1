/**
 * STEP text of straight prisms written as faces (IfcFacetedBrep, IfcPolygonalFaceSet, IfcTriangulatedFaceSet), for the
 * body-reading specs: a section outline extruded along local z, optionally through a point transform. Invented
 * shapes, built so that a cut can be compared with the outline it came from.
 */
import { type Mat4, transformPoint, type Vec3 } from './matrix4';

export type Outline2 = { outer: [number, number][]; voids: [number, number][][] };

/** An I with its four root fillets as `segments` chords each, outer loop counter-clockwise, centred on the box. */
export function iOutline(depth: number, width: number, web: number, flange: number, root: number, segments: number): Outline2 {
  const [h, b, t] = [depth / 2, width / 2, web / 2];
  // The fillet between the web face (x = t) and the flange's inner face (y = h − flange), centre (t + r, h − flange − r).
  const fillet = (sx: number, sy: number): [number, number][] => {
    const cx = t + root;
    const cy = h - flange - root;
    const points: [number, number][] = [];
    for (let i = 0; i <= segments; i++) {
      const a = Math.PI + (i / segments) * (Math.PI / 2);
      points.push([sx * (cx + root * Math.cos(a)), sy * (cy - root * Math.sin(a))]);
    }
    return points;
  };
  // Each fillet runs from the web to the flange; the loop meets half of them the other way round.
  const bottomRight = fillet(1, -1).reverse();
  const topRight = fillet(1, 1);
  const topLeft = fillet(-1, 1).reverse();
  const bottomLeft = fillet(-1, -1);
  const outer: [number, number][] = [
    [-b, -h],
    [b, -h],
    [b, -h + flange],
    ...bottomRight,
    ...topRight,
    [b, h - flange],
    [b, h],
    [-b, h],
    [-b, h - flange],
    ...topLeft,
    ...bottomLeft,
    [-b, -h + flange],
  ];
  return { outer, voids: [] };
}

/** A parallel-flange channel with square inner corners: web on the left, flanges to +x, centred on the box. */
export function channelOutline(depth: number, width: number, web: number, flange: number): Outline2 {
  const [h, b] = [depth / 2, width / 2];
  return {
    outer: [
      [-b, -h],
      [b, -h],
      [b, -h + flange],
      [-b + web, -h + flange],
      [-b + web, h - flange],
      [b, h - flange],
      [b, h],
      [-b, h],
    ],
    voids: [],
  };
}

/** A rectangular hollow section with square corners: outer loop counter-clockwise, the void clockwise. */
export function boxOutline(depth: number, width: number, wall: number): Outline2 {
  const rectangle = (w: number, h: number): [number, number][] => [
    [-w / 2, -h / 2],
    [w / 2, -h / 2],
    [w / 2, h / 2],
    [-w / 2, h / 2],
  ];
  return { outer: rectangle(width, depth), voids: [rectangle(width - 2 * wall, depth - 2 * wall).reverse()] };
}

/** Collects entity instances and numbers them. */
export class StepWriter {
  private readonly lines: string[] = [];
  private next = 100;

  add(entity: string): number {
    const id = this.next++;
    this.lines.push(`#${id}= ${entity};`);
    return id;
  }

  /** A whole IFC4 file; the few lines every file has come first. */
  file(): Uint8Array {
    const text = [
      'ISO-10303-21;',
      'HEADER;',
      "FILE_DESCRIPTION(('ViewDefinition [ReferenceView]'),'2;1');",
      "FILE_NAME('bodies.ifc','2026-12-05T09:00:00',('Taulens tests'),('Taulens'),'body-step','body-step','');",
      "FILE_SCHEMA(('IFC4'));",
      'ENDSEC;',
      'DATA;',
      "#1= IFCPROJECT('0BodyProject000000001',$,'Bodies',$,$,$,$,(#10),$);",
      "#10= IFCGEOMETRICREPRESENTATIONCONTEXT($,'Model',3,1.E-05,#11,$);",
      '#11= IFCAXIS2PLACEMENT3D(#12,$,$);',
      '#12= IFCCARTESIANPOINT((0.,0.,0.));',
      ...this.lines,
      'ENDSEC;',
      'END-ISO-10303-21;',
    ].join('\n');
    return new TextEncoder().encode(text);
  }
}

const real = (n: number): string => (Number.isInteger(n) ? `${n}.` : String(n));
const triple = (p: Vec3): string => `(${real(p[0])},${real(p[1])},${real(p[2])})`;

/** A prism's corners: the outline's loops at z = 0 (first) and z = length (second), through `place`. */
interface PrismCorners {
  /** Per loop (outer first), its points at z = 0 and at z = length. */
  loops: { bottom: Vec3[]; top: Vec3[] }[];
}

/** The outline at z = 0 and the (optionally scaled) outline at z = length, placed by `place`. */
function prismCorners(outline: Outline2, length: number, place?: Mat4, topScale = 1): PrismCorners {
  const at = (p: [number, number], z: number, s: number): Vec3 => {
    const local: Vec3 = [p[0] * s, p[1] * s, z];
    return place ? transformPoint(place, local) : local;
  };
  return {
    loops: [outline.outer, ...outline.voids].map((loop) => ({ bottom: loop.map((p) => at(p, 0, 1)), top: loop.map((p) => at(p, length, topScale)) })),
  };
}

/** Each face of a prism as loops of corner points: the two caps with their holes, and a quad per outline edge. */
function prismFaces(corners: PrismCorners): Vec3[][][] {
  const faces: Vec3[][][] = [];
  faces.push(corners.loops.map((l) => [...l.bottom].reverse()));
  faces.push(corners.loops.map((l) => l.top));
  for (const { bottom, top } of corners.loops) {
    for (let i = 0; i < bottom.length; i++) {
      const j = (i + 1) % bottom.length;
      faces.push([[bottom[i], bottom[j], top[j], top[i]]]);
    }
  }
  return faces;
}

/** IfcFace lines of faces given as loops of points (the outer one first); answers their ids. */
export function stepFaces(writer: StepWriter, faces: Vec3[][][]): number[] {
  return faces.map((loops) => {
    const bounds = loops.map((loop, k) => {
      const points = loop.map((p) => writer.add(`IFCCARTESIANPOINT(${triple(p)})`));
      const polyLoop = writer.add(`IFCPOLYLOOP((${points.map((p) => `#${p}`).join(',')}))`);
      return writer.add(`${k === 0 ? 'IFCFACEOUTERBOUND' : 'IFCFACEBOUND'}(#${polyLoop},.T.)`);
    });
    return writer.add(`IFCFACE((${bounds.map((b) => `#${b}`).join(',')}))`);
  });
}

/** IfcFacetedBrep of faces (each a list of loops, the outer one first); `open` writes an IfcShellBasedSurfaceModel. */
export function facetedBrep(writer: StepWriter, faces: Vec3[][][], open = false): number {
  const list = stepFaces(writer, faces)
    .map((f) => `#${f}`)
    .join(',');
  if (open) return writer.add(`IFCSHELLBASEDSURFACEMODEL((#${writer.add(`IFCOPENSHELL((${list}))`)}))`);
  return writer.add(`IFCFACETEDBREP(#${writer.add(`IFCCLOSEDSHELL((${list}))`)})`);
}

export interface PrismOptions {
  /** Applied to every point (a body written already rotated and placed). */
  place?: Mat4;
  /** The outline at z = length is this many times the one at z = 0 (a tapered body). */
  topScale?: number;
}

export function prismBrep(writer: StepWriter, outline: Outline2, length: number, options: PrismOptions = {}): number {
  return facetedBrep(writer, prismFaces(prismCorners(outline, length, options.place, options.topScale)));
}

/** The faces of a prism, for bodies assembled from several (two solids in one shell, an open shell). */
export function prismFaceLoops(outline: Outline2, length: number, options: PrismOptions = {}): Vec3[][][] {
  return prismFaces(prismCorners(outline, length, options.place, options.topScale));
}

/** IfcPolygonalFaceSet over one point list: caps as faces with voids, sides as quads. */
export function prismPolygonalFaceSet(writer: StepWriter, outline: Outline2, length: number, options: PrismOptions = {}): number {
  const { list, loops } = pointList(writer, outline, length, options);
  const faces: string[] = [];
  const face = (outer: number[], inner: number[][]): number =>
    writer.add(
      inner.length === 0
        ? `IFCINDEXEDPOLYGONALFACE((${outer.join(',')}))`
        : `IFCINDEXEDPOLYGONALFACEWITHVOIDS((${outer.join(',')}),(${inner.map((l) => `(${l.join(',')})`).join(',')}))`,
    );
  faces.push(`#${face([...loops[0].bottom].reverse(), loops.slice(1).map((l) => [...l.bottom].reverse()))}`);
  faces.push(`#${face(loops[0].top, loops.slice(1).map((l) => l.top))}`);
  for (const quad of sideQuads(loops)) faces.push(`#${face(quad, [])}`);
  return writer.add(`IFCPOLYGONALFACESET(#${list},.T.,(${faces.join(',')}),$)`);
}

/**
 * IfcTriangulatedFaceSet: sides split into two triangles each, caps as fans from their first point (right for the
 * convex hull only, which the cuts away from the ends never see). The point list is written in reverse and reached
 * through PnIndex, to read that path too.
 */
export function prismTriangulatedFaceSet(writer: StepWriter, outline: Outline2, length: number, options: PrismOptions = {}): number {
  const { list, loops, count } = pointList(writer, outline, length, options, true);
  const triangles: number[][] = [];
  for (const cap of [loops[0].bottom, loops[0].top]) {
    for (let i = 1; i + 1 < cap.length; i++) triangles.push([cap[0], cap[i], cap[i + 1]]);
  }
  for (const [a, b, c, d] of sideQuads(loops)) triangles.push([a, b, c], [a, c, d]);
  const pnIndex = Array.from({ length: count }, (_, i) => count - i);
  return writer.add(`IFCTRIANGULATEDFACESET(#${list},$,.T.,(${triangles.map((t) => `(${t.join(',')})`).join(',')}),(${pnIndex.join(',')}))`);
}

function sideQuads(loops: { bottom: number[]; top: number[] }[]): number[][] {
  const quads: number[][] = [];
  for (const { bottom, top } of loops) {
    for (let i = 0; i < bottom.length; i++) {
      const j = (i + 1) % bottom.length;
      quads.push([bottom[i], bottom[j], top[j], top[i]]);
    }
  }
  return quads;
}

/** One IfcCartesianPointList3D of all corners; indices are 1-based (through PnIndex when `reversed`). */
function pointList(
  writer: StepWriter,
  outline: Outline2,
  length: number,
  options: PrismOptions,
  reversed = false,
): { list: number; loops: { bottom: number[]; top: number[] }[]; count: number } {
  const corners = prismCorners(outline, length, options.place, options.topScale);
  const points: Vec3[] = [];
  const loops = corners.loops.map(({ bottom, top }) => ({
    bottom: bottom.map((p) => points.push(p)),
    top: top.map((p) => points.push(p)),
  }));
  const written = reversed ? [...points].reverse() : points;
  const list = writer.add(`IFCCARTESIANPOINTLIST3D((${written.map(triple).join(',')}))`);
  return { list, loops, count: points.length };
}

/** A product shape with one 'Body' representation of these items. */
export function productShape(writer: StepWriter, items: number[]): number {
  const representation = writer.add(`IFCSHAPEREPRESENTATION(#10,'Body','Brep',(${items.map((i) => `#${i}`).join(',')}))`);
  return writer.add(`IFCPRODUCTDEFINITIONSHAPE($,$,(#${representation}))`);
}

/** An IfcMappedItem of these items, placed by an IfcCartesianTransformationOperator3D (axes x, y, z; origin). */
export function mappedItem(writer: StepWriter, items: number[], axes: [Vec3, Vec3, Vec3], origin: Vec3): number {
  const representation = writer.add(`IFCSHAPEREPRESENTATION(#10,'Body','Brep',(${items.map((i) => `#${i}`).join(',')}))`);
  const map = writer.add(`IFCREPRESENTATIONMAP(#11,#${representation})`);
  const [d1, d2, d3] = axes.map((a) => writer.add(`IFCDIRECTION(${triple(a)})`));
  const o = writer.add(`IFCCARTESIANPOINT(${triple(origin)})`);
  const operator = writer.add(`IFCCARTESIANTRANSFORMATIONOPERATOR3D(#${d1},#${d2},#${o},$,#${d3})`);
  return writer.add(`IFCMAPPEDITEM(#${map},#${operator})`);
}

/** An IfcBooleanClippingResult removing the half space on the side `normal` points to, from the plane through `point`. */
export function clipped(writer: StepWriter, body: number, point: Vec3, normal: Vec3): number {
  const origin = writer.add(`IFCCARTESIANPOINT(${triple(point)})`);
  const axis = writer.add(`IFCDIRECTION(${triple(normal)})`);
  const plane = writer.add(`IFCPLANE(#${writer.add(`IFCAXIS2PLACEMENT3D(#${origin},#${axis},$)`)})`);
  // AgreementFlag .F.: the half space's material lies on the side its plane's normal points to.
  const halfSpace = writer.add(`IFCHALFSPACESOLID(#${plane},.F.)`);
  return writer.add(`IFCBOOLEANCLIPPINGRESULT(.DIFFERENCE.,#${body},#${halfSpace})`);
}
