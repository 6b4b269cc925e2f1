/**
 * Materials associated with elements and element types (IfcRelAssociatesMaterial), resolved to the material name and,
 * for the IFC4 way of modelling members, the profile of the IfcMaterialProfileSetUsage → IfcMaterialProfile.
 * Layer sets, lists and constituent sets give their first material.
 */
import {
  IFCMATERIAL,
  IFCMATERIALCONSTITUENT,
  IFCMATERIALCONSTITUENTSET,
  IFCMATERIALLAYER,
  IFCMATERIALLAYERSET,
  IFCMATERIALLAYERSETUSAGE,
  IFCMATERIALLAYERWITHOFFSETS,
  IFCMATERIALLIST,
  IFCMATERIALPROFILE,
  IFCMATERIALPROFILESET,
  IFCMATERIALPROFILESETUSAGE,
  IFCMATERIALPROFILESETUSAGETAPERING,
  IFCMATERIALPROFILEWITHOFFSETS,
  IFCRELASSOCIATESMATERIAL,
} from 'web-ifc';
import type { MemberFlag } from './model-read-result';
import { refOf, refsOf, type StepLines, textOf } from './step-lines';

export interface MaterialReading {
  /** Name of the (first) IfcMaterial, or null when the association leads to none. */
  name: string | null;
  /** Profile of the material profile, when the association is a profile set (usage). */
  profileId?: number;
  /** IfcMaterialProfile's or IfcMaterialProfileSet's name: often the section designation. */
  profileName?: string | null;
  flags: MemberFlag[];
}

const MAX_DEPTH = 6;

export class MaterialReader {
  private readonly associations = new Map<number, number>();
  private readonly cache = new Map<number, MaterialReading>();

  constructor(private readonly lines: StepLines) {
    for (const relId of lines.idsOfType(IFCRELASSOCIATESMATERIAL)) {
      const rel = lines.line(relId);
      const material = refOf(rel?.args[5]);
      if (material === undefined) continue;
      for (const object of refsOf(rel?.args[4])) {
        // The first association wins; a second one for the same object is a modelling error we do not resolve.
        if (!this.associations.has(object)) this.associations.set(object, material);
      }
    }
  }

  /** The material of an element, else of its type. */
  materialOf(elementId: number, typeId: number | undefined): MaterialReading | undefined {
    const select = this.associations.get(elementId) ?? (typeId === undefined ? undefined : this.associations.get(typeId));
    if (select === undefined) return undefined;
    let reading = this.cache.get(select);
    if (!reading) {
      reading = this.resolve(select, 0);
      this.cache.set(select, reading);
    }
    return reading;
  }

  private materialName(id: number | undefined): string | null {
    const line = this.lines.line(id);
    return line?.type === IFCMATERIAL ? textOf(line.args[0]) : null;
  }

  private resolve(id: number | undefined, depth: number): MaterialReading {
    const line = this.lines.line(id);
    if (!line || depth > MAX_DEPTH) return { name: null, flags: [] };
    const first = (ids: number[], flags: MemberFlag[] = []): MaterialReading => {
      const reading = this.resolve(ids[0], depth + 1);
      return ids.length > 1 ? { ...reading, flags: [...reading.flags, ...flags] } : reading;
    };
    switch (line.type) {
      case IFCMATERIAL:
        return { name: textOf(line.args[0]), flags: [] };
      case IFCMATERIALPROFILESETUSAGE:
        return this.resolve(refOf(line.args[0]), depth + 1);
      case IFCMATERIALPROFILESETUSAGETAPERING: {
        const reading = this.resolve(refOf(line.args[0]), depth + 1);
        return { ...reading, flags: [...reading.flags, 'tapered'] };
      }
      case IFCMATERIALPROFILESET: {
        const reading = first(refsOf(line.args[2]), ['several-profiles']);
        return { ...reading, profileName: reading.profileName ?? textOf(line.args[0]) };
      }
      case IFCMATERIALPROFILE:
      case IFCMATERIALPROFILEWITHOFFSETS:
        return { name: this.materialName(refOf(line.args[2])), profileId: refOf(line.args[3]), profileName: textOf(line.args[0]), flags: [] };
      case IFCMATERIALLAYERSETUSAGE:
        return this.resolve(refOf(line.args[0]), depth + 1);
      case IFCMATERIALLAYERSET:
        return first(refsOf(line.args[0]));
      case IFCMATERIALLAYER:
      case IFCMATERIALLAYERWITHOFFSETS:
        return { name: this.materialName(refOf(line.args[0])), flags: [] };
      case IFCMATERIALLIST:
        return first(refsOf(line.args[0]));
      case IFCMATERIALCONSTITUENTSET:
        return first(refsOf(line.args[2]));
      case IFCMATERIALCONSTITUENT:
        return { name: this.materialName(refOf(line.args[2])), flags: [] };
      default:
        return { name: null, flags: [] };
    }
  }
}
