/**
 * Section designations that exporters leave only in property sets: single values named like 'Profile', 'Section',
 * 'ProfileName' or 'SectionName' on the element (IfcRelDefinesByProperties) or on its type (HasPropertySets). The index
 * of relationships is built on first use, because most members find their section without it.
 */
import { IFCPROPERTYSET, IFCPROPERTYSINGLEVALUE, IFCRELDEFINESBYPROPERTIES } from 'web-ifc';
import { refOf, refsOf, type StepLines, textOf } from './step-lines';

/** Property names that hold a section designation (compared without case, spaces or underscores). */
const SECTION_PROPERTY = /^(profile|profilename|section|sectionname|crosssection|sectionprofile)$/;
/** IfcTypeObject.HasPropertySets. */
const TYPE_PROPERTY_SETS_AT = 5;

export class PropertyNames {
  private setsByObject: Map<number, number[]> | undefined;
  private readonly namesBySet = new Map<number, string[]>();

  constructor(private readonly lines: StepLines) {}

  /** Designation-like values of the element's and then its type's property sets, in file order. */
  sectionNamesOf(elementId: number, typeId: number | undefined): string[] {
    const sets = [...(this.index().get(elementId) ?? [])];
    if (typeId !== undefined) sets.push(...(this.index().get(typeId) ?? []), ...refsOf(this.lines.line(typeId)?.args[TYPE_PROPERTY_SETS_AT]));
    return [...new Set(sets.flatMap((id) => this.namesOf(id)))];
  }

  private index(): Map<number, number[]> {
    if (!this.setsByObject) {
      const index = new Map<number, number[]>();
      for (const relId of this.lines.idsOfType(IFCRELDEFINESBYPROPERTIES)) {
        const rel = this.lines.line(relId);
        const set = refOf(rel?.args[5]);
        if (set === undefined || this.lines.typeOf(set) !== IFCPROPERTYSET) continue;
        for (const object of refsOf(rel?.args[4])) {
          const list = index.get(object);
          if (list) list.push(set);
          else index.set(object, [set]);
        }
      }
      this.setsByObject = index;
    }
    return this.setsByObject;
  }

  private namesOf(setId: number): string[] {
    let names = this.namesBySet.get(setId);
    if (!names) {
      names = [];
      for (const propertyId of refsOf(this.lines.line(setId)?.args[4])) {
        if (this.lines.typeOf(propertyId) !== IFCPROPERTYSINGLEVALUE) continue;
        const property = this.lines.line(propertyId);
        const name = textOf(property?.args[0])?.toLowerCase().replace(/[\s_-]+/g, '');
        const value = textOf(property?.args[2]);
        if (name && SECTION_PROPERTY.test(name) && value && value.trim()) names.push(value.trim());
      }
      this.namesBySet.set(setId, names);
    }
    return names;
  }
}
