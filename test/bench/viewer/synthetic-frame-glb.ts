/**
 * Synthetic steel frames for the viewer benchmark, written as the ingest writes a revision's .glb (the contract at
 * the top of server/ifc/glb-writer.ts): one node per element named by its GlobalId, extras {globalId, expressId,
 * ifcClass, context}, interleaved POSITION + NORMAL, indices, materials 'member' and 'context', metres, Y up,
 * vertices in scene coordinates under identity nodes, the model offset in the scene extras. Every member gets its
 * own mesh, as tessellated IFC geometry does, which is the hard case for a viewer. Invented data: grid, storeys and
 * section sizes are made up for load, not taken from any project.
 */
import { Document, type Material, WebIO } from '@gltf-transform/core';

interface Section {
  depth: number;
  width: number;
  web: number;
  flange: number;
}

/** Rounded I-section proportions in metres (depth, width, web, flange); invented sizes of the usual order. */
const SECTIONS_M: readonly Section[] = [
  { depth: 0.3, width: 0.15, web: 0.0071, flange: 0.0107 },
  { depth: 0.4, width: 0.18, web: 0.0086, flange: 0.0135 },
  { depth: 0.24, width: 0.24, web: 0.01, flange: 0.017 },
];

const BAY_M = 6;
const STOREY_M = 3.6;
const GLOBAL_ID_CHARACTERS = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$';

/** A 22-character IFC GlobalId from a number, so runs are repeatable. */
export function syntheticGlobalId(n: number): string {
  let id = '';
  let rest = n * 2654435761 + 977;
  for (let i = 0; i < 22; i++) {
    id += GLOBAL_ID_CHARACTERS[rest % 64];
    rest = Math.floor(rest / 64) + (i + 1) * 7919 * (n + 1);
  }
  return id;
}

/** The 12 corners of an I-profile, counter-clockwise, x across the flanges and y along the depth. */
function profile({ depth, width, web, flange }: Section): [number, number][] {
  const [h, b, t] = [depth / 2, width / 2, web / 2];
  return [
    [-b, -h],
    [b, -h],
    [b, -h + flange],
    [t, -h + flange],
    [t, h - flange],
    [b, h - flange],
    [b, h],
    [-b, h],
    [-b, h - flange],
    [-t, h - flange],
    [-t, -h + flange],
    [-b, -h + flange],
  ];
}

// Cap triangles over the profile corners: bottom flange, web, top flange, with no T-junctions.
const CAP_TRIANGLES = [0, 1, 2, 0, 2, 3, 0, 3, 10, 0, 10, 11, 10, 3, 4, 10, 4, 9, 9, 4, 5, 9, 5, 6, 9, 6, 7, 9, 7, 8];

/** An I-section extruded along local +Z from 0 to `length_m`, flat-shaded: 72 vertices, 44 triangles. */
interface MeshArrays {
  positions: Float32Array;
  normals: Float32Array;
  indices: Uint16Array;
}

type Quaternion = [number, number, number, number];
type Triple = [number, number, number];

export function iBeamGeometry(section: Section, length_m: number): MeshArrays {
  const corners = profile(section);
  const positions: number[] = [];
  const normals: number[] = [];
  const indices: number[] = [];
  corners.forEach(([ax, ay], i) => {
    const [bx, by] = corners[(i + 1) % corners.length];
    const [dx, dy] = [bx - ax, by - ay];
    const length = Math.hypot(dx, dy);
    const base = positions.length / 3;
    positions.push(ax, ay, 0, bx, by, 0, bx, by, length_m, ax, ay, length_m);
    for (let k = 0; k < 4; k++) normals.push(dy / length, -dx / length, 0);
    indices.push(base, base + 1, base + 2, base, base + 2, base + 3);
  });
  for (const [z, nz] of [
    [0, -1],
    [length_m, 1],
  ]) {
    const base = positions.length / 3;
    for (const [x, y] of corners) {
      positions.push(x, y, z);
      normals.push(0, 0, nz);
    }
    for (let i = 0; i < CAP_TRIANGLES.length; i += 3) {
      const [a, b, c] = [CAP_TRIANGLES[i], CAP_TRIANGLES[i + 1], CAP_TRIANGLES[i + 2]];
      // The start cap faces −Z, so its triangles turn the other way.
      indices.push(base + a, ...(nz > 0 ? [base + b, base + c] : [base + c, base + b]));
    }
  }
  return {
    positions: new Float32Array(positions),
    normals: new Float32Array(normals),
    indices: new Uint16Array(indices),
  };
}

interface Placement {
  translation: Triple;
  rotation: Quaternion;
  scale?: Triple;
}

/** q · v · q⁻¹ for a unit quaternion [x, y, z, w]. */
function rotate([qx, qy, qz, qw]: Quaternion, [vx, vy, vz]: Triple): Triple {
  const [tx, ty, tz] = [2 * (qy * vz - qz * vy), 2 * (qz * vx - qx * vz), 2 * (qx * vy - qy * vx)];
  return [
    vx + qw * tx + (qy * tz - qz * ty),
    vy + qw * ty + (qz * tx - qx * tz),
    vz + qw * tz + (qx * ty - qy * tx),
  ];
}

/** The mesh moved into scene coordinates, since the contract's nodes carry no transform. */
function placed(mesh: MeshArrays, { translation, rotation, scale = [1, 1, 1] }: Placement): MeshArrays {
  const positions = new Float32Array(mesh.positions.length);
  const normals = new Float32Array(mesh.normals.length);
  const at = (array: Float32Array, i: number, factor: (axis: number) => number): Triple => [
    array[i] * factor(0),
    array[i + 1] * factor(1),
    array[i + 2] * factor(2),
  ];
  for (let i = 0; i < positions.length; i += 3) {
    const p = rotate(rotation, at(mesh.positions, i, (axis) => scale[axis]));
    positions.set([p[0] + translation[0], p[1] + translation[1], p[2] + translation[2]], i);
    // Normals scale by the inverse: the faces here are square to the axes, so this stays exact.
    const n = rotate(rotation, at(mesh.normals, i, (axis) => 1 / scale[axis]));
    const length = Math.hypot(n[0], n[1], n[2]);
    normals.set([n[0] / length, n[1] / length, n[2] / length], i);
  }
  return { positions, normals, indices: mesh.indices };
}

/** Rotations taking local +Z (the member axis) to glTF +X, glTF −Z (IFC +Y) and glTF +Y (up). */
const ALONG_X: Quaternion = [0, Math.SQRT1_2, 0, Math.SQRT1_2];
const ALONG_MINUS_Z: Quaternion = [0, 1, 0, 0];
const UPRIGHT: Quaternion = [-Math.SQRT1_2, 0, 0, Math.SQRT1_2];

interface MemberPlacement extends Placement {
  ifcClass: 'IfcBeam' | 'IfcColumn';
  section: Section;
  length_m: number;
}

/** Beams both ways and columns on a square grid, storey by storey, until `count` members. */
function* framePlacements(count: number): Generator<MemberPlacement> {
  const bays = Math.max(1, Math.round(Math.sqrt(count / 120)));
  let made = 0;
  for (let storey = 0; made < count; storey++) {
    const level = (storey + 1) * STOREY_M;
    for (let i = 0; i <= bays && made < count; i++) {
      for (let j = 0; j <= bays && made < count; j++) {
        const [x, z] = [i * BAY_M, -j * BAY_M];
        const beam = (section: Section, rotation: Quaternion): MemberPlacement => {
          made++;
          return { ifcClass: 'IfcBeam', section, length_m: BAY_M, translation: [x, level, z], rotation };
        };
        made++;
        yield {
          ifcClass: 'IfcColumn',
          section: SECTIONS_M[2],
          length_m: STOREY_M,
          translation: [x, level - STOREY_M, z],
          rotation: UPRIGHT,
        };
        if (i < bays && made < count) yield beam(SECTIONS_M[1], ALONG_X);
        if (j < bays && made < count) yield beam(SECTIONS_M[0], ALONG_MINUS_Z);
      }
    }
  }
}

export interface SyntheticModel {
  glb: Uint8Array;
  memberGlobalIds: string[];
  contextGlobalIds: string[];
}

/** A frame of `memberCount` I-section members plus one see-through slab per storey. */
export async function syntheticFrameGlb(memberCount: number): Promise<SyntheticModel> {
  const document = new Document();
  const buffer = document.createBuffer();
  const scene = document.createScene('frame').setExtras({ modelOffset_m: [1000, 2000, 0] });
  const memberGlobalIds: string[] = [];
  const contextGlobalIds: string[] = [];
  let expressId = 100;
  const materials: Record<'member' | 'context', Material> = {
    member: document.createMaterial('member').setBaseColorFactor([0.6, 0.62, 0.64, 1]),
    context: document.createMaterial('context').setBaseColorFactor([0.86, 0.87, 0.88, 0.3]).setAlphaMode('BLEND'),
  };
  const addElement = (globalId: string, ifcClass: string, context: boolean, mesh: MeshArrays) => {
    const accessor = (array: Float32Array | Uint16Array, type: 'VEC3' | 'SCALAR') =>
      document.createAccessor().setArray(array).setType(type).setBuffer(buffer);
    const primitive = document
      .createPrimitive()
      .setAttribute('POSITION', accessor(mesh.positions, 'VEC3'))
      .setAttribute('NORMAL', accessor(mesh.normals, 'VEC3'))
      .setIndices(accessor(mesh.indices, 'SCALAR'))
      .setMaterial(materials[context ? 'context' : 'member']);
    const node = document
      .createNode(globalId)
      .setMesh(document.createMesh().addPrimitive(primitive))
      .setExtras({ globalId, expressId: expressId++, ifcClass, context });
    scene.addChild(node);
  };

  let storeys = 0;
  let extent_m = 0;
  for (const member of framePlacements(memberCount)) {
    const globalId = syntheticGlobalId(memberGlobalIds.length);
    memberGlobalIds.push(globalId);
    addElement(globalId, member.ifcClass, false, placed(iBeamGeometry(member.section, member.length_m), member));
    storeys = Math.max(storeys, Math.round(member.translation[1] / STOREY_M) + 1);
    extent_m = Math.max(extent_m, member.translation[0]);
  }
  // Slabs as flat boxes: an I-profile of full width stands in for a box, scaled to the floor plate.
  const slab = iBeamGeometry({ depth: 1, width: 1, web: 0.98, flange: 0.4 }, 1);
  for (let storey = 1; storey <= storeys; storey++) {
    const globalId = syntheticGlobalId(1_000_000 + storey);
    contextGlobalIds.push(globalId);
    const plate = { translation: [extent_m / 2, storey * STOREY_M + 0.3, 0] as Triple, rotation: ALONG_MINUS_Z };
    addElement(globalId, 'IfcSlab', true, placed(slab, { ...plate, scale: [extent_m, 0.2, extent_m] }));
  }
  const glb = await new WebIO().writeBinary(document);
  return { glb, memberGlobalIds, contextGlobalIds };
}
