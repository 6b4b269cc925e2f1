import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { WebIO } from '@gltf-transform/core';
import type { ElementMesh } from './element-mesh';
import { glbBytes, writeGlbFile } from './glb-writer';

function triangleFan(expressId: number, vertexCount: number, x0: number): ElementMesh {
  const vertices = new Float32Array(vertexCount * 6);
  for (let v = 0; v < vertexCount; v++) vertices.set([x0 + v * 0.001, v % 2, 0, 0, 0, 1], v * 6);
  const triangles = vertexCount - 2;
  const indices = vertexCount <= 0xffff ? new Uint16Array(triangles * 3) : new Uint32Array(triangles * 3);
  for (let t = 0; t < triangles; t++) indices.set([0, t + 1, t + 2], t * 3);
  return { expressId, vertices, indices, min: [x0, 0, 0], max: [x0 + (vertexCount - 1) * 0.001, 1, 0] };
}

// Read back by @gltf-transform/core, a general-purpose glTF 2.0 reader, so the file follows the format (Khronos glTF 2.0).
async function read(glb: Uint8Array) {
  return new WebIO().readBinary(glb);
}

describe('glb writer', () => {
  const elements = [
    { mesh: triangleFan(11, 5, 0), globalId: '0A1b2C3d4E5f6G7h8I9j0K', ifcClass: 'IfcBeam', context: false },
    { mesh: triangleFan(12, 70_000, 2), globalId: '1A1b2C3d4E5f6G7h8I9j0K', ifcClass: 'IfcColumn', context: false },
    { mesh: triangleFan(13, 3, 5), globalId: '2A1b2C3d4E5f6G7h8I9j0K', ifcClass: 'IfcSlab', context: true },
  ];

  it('writes one named node per element with the contract extras', async () => {
    const document = await read(glbBytes({ elements }));
    const nodes = document.getRoot().listNodes();
    expect(nodes.map((n) => n.getName())).toEqual(elements.map((e) => e.globalId));
    expect(nodes[2].getExtras()).toEqual({ globalId: elements[2].globalId, expressId: 13, ifcClass: 'IfcSlab', context: true });
    expect(nodes.map((n) => n.getMesh()!.listPrimitives()[0].getMaterial()!.getName())).toEqual(['member', 'member', 'context']);
  });

  it('keeps positions, normals and indices, with 32-bit indices only where needed', async () => {
    const document = await read(glbBytes({ elements }));
    const [small, large] = document.getRoot().listNodes().map((n) => n.getMesh()!.listPrimitives()[0]);
    expect(Array.from(small.getAttribute('POSITION')!.getArray()!)).toEqual(Array.from(elements[0].mesh.vertices.filter((_, i) => i % 6 < 3)));
    expect(Array.from(small.getAttribute('NORMAL')!.getElement(4, []))).toEqual([0, 0, 1]);
    expect(small.getIndices()!.getArray()).toBeInstanceOf(Uint16Array);
    expect(large.getIndices()!.getArray()).toBeInstanceOf(Uint32Array);
    expect(large.getIndices()!.getCount()).toBe((70_000 - 2) * 3);
  });

  it('states the model offset in the scene extras when given', async () => {
    const document = await read(glbBytes({ elements, modelOffset_m: [485000, 5270000, 12] }));
    expect(document.getRoot().listScenes()[0].getExtras()).toEqual({ modelOffset_m: [485000, 5270000, 12] });
  });

  it('writes a valid file for a model without geometry', async () => {
    const document = await read(glbBytes({ elements: [] }));
    expect(document.getRoot().listNodes()).toHaveLength(0);
  });

  it('writes the same bytes to a file, leaving no partial file behind', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-glb-'));
    try {
      const file = path.join(dir, 'model.glb');
      const length = writeGlbFile({ elements }, file);
      expect(fs.readFileSync(file).equals(Buffer.from(glbBytes({ elements })))).toBe(true);
      expect(fs.statSync(file).size).toBe(length);
      expect(fs.readdirSync(dir)).toEqual(['model.glb']);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
