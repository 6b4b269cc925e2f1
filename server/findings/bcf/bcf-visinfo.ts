/**
 * viewpoint.bcfv (VisualizationInfo): camera, selected and hidden/shown components, clipping planes. Element order
 * follows visinfo.xsd of each release. Coordinates are IFC model coordinates in metres, Z up, as BCF defines them.
 */
import type {
  ClippingPlane,
  FindingCamera,
  FindingViewpoint,
  ModelVector,
} from '../export/finding-export';
import type { BcfVersion } from './bcf-version';
import { type XmlNode, attributeOf, buildXmlDocument, childOf, childText, childrenOf } from './bcf-xml';

/**
 * BCF 2.1 visinfo.xsd restricts FieldOfView to 45–60°; 3.0 accepts (0, 180). A 2.1 file therefore gets the nearest
 * allowed angle, which frames a little more or less than the view it came from.
 */
const FIELD_OF_VIEW_2_1_DEG = { min: 45, max: 60 } as const;

function vectorNode(vector: ModelVector): XmlNode {
  return { X: vector[0], Y: vector[1], Z: vector[2] };
}

function componentNodes(globalIds: readonly string[]): XmlNode[] {
  return globalIds.map((globalId): XmlNode => ({ '@_IfcGuid': globalId }));
}

function cameraNode(camera: FindingCamera, version: BcfVersion): { name: string; node: XmlNode } {
  const placement: XmlNode = {
    CameraViewPoint: vectorNode(camera.viewPoint_m),
    CameraDirection: vectorNode(camera.direction),
    CameraUpVector: vectorNode(camera.up),
  };
  const aspect = version === '3.0' ? { AspectRatio: camera.aspectRatio } : {};
  if (camera.kind === 'orthogonal') {
    return { name: 'OrthogonalCamera', node: { ...placement, ViewToWorldScale: camera.viewToWorldScale_m, ...aspect } };
  }
  const fieldOfView =
    version === '2.1'
      ? Math.min(FIELD_OF_VIEW_2_1_DEG.max, Math.max(FIELD_OF_VIEW_2_1_DEG.min, camera.fieldOfView_deg))
      : camera.fieldOfView_deg;
  return { name: 'PerspectiveCamera', node: { ...placement, FieldOfView: fieldOfView, ...aspect } };
}

function componentsNode(viewpoint: FindingViewpoint): XmlNode {
  const selected = componentNodes(viewpoint.selectedGlobalIds);
  const exceptions = componentNodes(viewpoint.visibility.exceptionGlobalIds);
  // 2.1 needs at least one Component inside Selection and Exceptions, so empty lists are left out in both releases.
  return {
    Selection: selected.length > 0 ? { Component: selected } : undefined,
    Visibility: {
      '@_DefaultVisibility': viewpoint.visibility.defaultVisible,
      Exceptions: exceptions.length > 0 ? { Component: exceptions } : undefined,
    },
  };
}

/** Builds the VisualizationInfo document; `guid` is the viewpoint's UUID. */
export function buildVisinfo(guid: string, viewpoint: FindingViewpoint, version: BcfVersion): Buffer {
  const camera = viewpoint.camera ? cameraNode(viewpoint.camera, version) : undefined;
  const planes = (viewpoint.clippingPlanes ?? []).map(
    (plane): XmlNode => ({ Location: vectorNode(plane.location_m), Direction: vectorNode(plane.direction) }),
  );
  const root: XmlNode = {
    '@_Guid': guid,
    Components: componentsNode(viewpoint),
    ...(camera && { [camera.name]: camera.node }),
    ClippingPlanes: planes.length > 0 ? { ClippingPlane: planes } : undefined,
  };
  return buildXmlDocument('VisualizationInfo', root);
}

export interface ImportedViewpoint {
  guid: string;
  camera?: FindingCamera;
  selectedGlobalIds: string[];
  visibility: { defaultVisible: boolean; exceptionGlobalIds: string[] };
  clippingPlanes: ClippingPlane[];
}

/** xs:boolean allows true/false and 1/0. */
function isXmlTrue(value: string | undefined): boolean {
  return value === 'true' || value === '1';
}

function readNumber(node: unknown, name: string): number {
  const text = childText(node, name);
  return text === undefined ? Number.NaN : Number(text);
}

function readVector(node: unknown): ModelVector {
  return [readNumber(node, 'X'), readNumber(node, 'Y'), readNumber(node, 'Z')];
}

function readGlobalIds(node: unknown): string[] {
  return childrenOf(node, 'Component')
    .map((component) => attributeOf(component, 'IfcGuid'))
    .filter((globalId): globalId is string => globalId !== undefined);
}

function readCamera(root: unknown): FindingCamera | undefined {
  const orthogonal = childOf(root, 'OrthogonalCamera');
  const perspective = childOf(root, 'PerspectiveCamera');
  const source = orthogonal ?? perspective;
  if (source === undefined) return undefined;
  const placement = {
    viewPoint_m: readVector(childOf(source, 'CameraViewPoint')),
    direction: readVector(childOf(source, 'CameraDirection')),
    up: readVector(childOf(source, 'CameraUpVector')),
    // 2.1 has no aspect ratio; 4:3 is what most 2.1 writers rendered their snapshots at (from memory).
    aspectRatio: childText(source, 'AspectRatio') === undefined ? 4 / 3 : readNumber(source, 'AspectRatio'),
  };
  if (orthogonal !== undefined) {
    return { kind: 'orthogonal', ...placement, viewToWorldScale_m: readNumber(source, 'ViewToWorldScale') };
  }
  return { kind: 'perspective', ...placement, fieldOfView_deg: readNumber(source, 'FieldOfView') };
}

/** Reads a parsed viewpoint file of either release (the element names that matter are shared). */
export function readVisinfo(tree: Record<string, unknown>): ImportedViewpoint {
  const root = tree['VisualizationInfo'];
  const components = childOf(root, 'Components');
  const visibility = childOf(components, 'Visibility');
  return {
    guid: attributeOf(root, 'Guid') ?? '',
    camera: readCamera(root),
    selectedGlobalIds: readGlobalIds(childOf(components, 'Selection')),
    visibility: {
      // Absent means false: 3.0's schema default, and 2.1's documentation as far as we know (from memory).
      defaultVisible: isXmlTrue(attributeOf(visibility, 'DefaultVisibility')),
      exceptionGlobalIds: readGlobalIds(childOf(visibility, 'Exceptions')),
    },
    clippingPlanes: childrenOf(childOf(root, 'ClippingPlanes'), 'ClippingPlane').map((plane) => ({
      location_m: readVector(childOf(plane, 'Location')),
      direction: readVector(childOf(plane, 'Direction')),
    })),
  };
}
