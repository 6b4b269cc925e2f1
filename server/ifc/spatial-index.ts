/**
 * Where elements sit and what type they have, from the relationship lines, read once per model: the storey through
 * IfcRelContainedInSpatialStructure (walking up IfcRelAggregates from a space, or from an assembly an element is
 * part of), and the element type through IfcRelDefinesByType.
 */
import { IFCBUILDINGSTOREY, IFCRELAGGREGATES, IFCRELCONTAINEDINSPATIALSTRUCTURE, IFCRELDEFINESBYTYPE } from 'web-ifc';
import { refOf, refsOf, type StepLines, textOf } from './step-lines';

const MAX_LEVELS = 16;

function manyToOne(lines: StepLines, relationType: number, manyAt: number, oneAt: number): Map<number, number> {
  const map = new Map<number, number>();
  for (const relId of lines.idsOfType(relationType)) {
    const rel = lines.line(relId);
    const one = refOf(rel?.args[oneAt]);
    if (one === undefined) continue;
    for (const many of refsOf(rel?.args[manyAt])) if (!map.has(many)) map.set(many, one);
  }
  return map;
}

export class SpatialIndex {
  private readonly containedIn: Map<number, number>;
  private readonly parentOf: Map<number, number>;
  private readonly typeOfElement: Map<number, number>;
  private readonly storeyNames = new Map<number, string | null>();

  constructor(private readonly lines: StepLines) {
    this.containedIn = manyToOne(lines, IFCRELCONTAINEDINSPATIALSTRUCTURE, 4, 5);
    this.parentOf = manyToOne(lines, IFCRELAGGREGATES, 5, 4);
    this.typeOfElement = manyToOne(lines, IFCRELDEFINESBYTYPE, 4, 5);
  }

  typeOf(elementId: number): number | undefined {
    return this.typeOfElement.get(elementId);
  }

  /** Name of the storey the element is on, or null when it is not placed in one. */
  storeyOf(elementId: number): string | null {
    let id: number | undefined = elementId;
    for (let level = 0; level < MAX_LEVELS && id !== undefined; level++) {
      const container = this.containedIn.get(id);
      if (container !== undefined) return this.storeyAbove(container);
      id = this.parentOf.get(id);
    }
    return null;
  }

  private storeyAbove(structureId: number): string | null {
    const cached = this.storeyNames.get(structureId);
    if (cached !== undefined) return cached;
    let name: string | null = null;
    let id: number | undefined = structureId;
    for (let level = 0; level < MAX_LEVELS && id !== undefined; level++) {
      if (this.lines.typeOf(id) === IFCBUILDINGSTOREY) {
        const storey = this.lines.line(id);
        // Name, else LongName (position 7): some exporters leave Name empty.
        name = textOf(storey?.args[2]) || textOf(storey?.args[7]) || `storey #${id}`;
        break;
      }
      id = this.parentOf.get(id);
    }
    this.storeyNames.set(structureId, name);
    return name;
  }
}
