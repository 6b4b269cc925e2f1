/**
 * Which batch instances draw which element. Elements usually have one instance; an element whose mesh has several
 * primitives has several, always with consecutive instance ids, so an element is a range [first, end).
 */
export class ElementIndex {
  private constructor(
    /** Element number → GlobalId. */
    readonly globalIds: readonly string[],
    private readonly elementByGlobalId: ReadonlyMap<string, number>,
    /** Element number → its first instance; one extra entry closes the last range. */
    private readonly firstInstances: Int32Array,
    /** Instance id → element number. */
    private readonly elementByInstance: Int32Array,
  ) {}

  /**
   * `instanceCounts[e]` instances for element `e`, numbered in element order from 0. Throws when a GlobalId repeats,
   * since colours and picks could then reach the wrong member.
   */
  static fromElements(globalIds: readonly string[], instanceCounts: readonly number[]): ElementIndex {
    if (globalIds.length !== instanceCounts.length) {
      throw new Error(`ElementIndex: ${globalIds.length} GlobalIds but ${instanceCounts.length} instance counts.`);
    }
    const elementByGlobalId = new Map<string, number>();
    const firstInstances = new Int32Array(globalIds.length + 1);
    globalIds.forEach((globalId, element) => {
      if (elementByGlobalId.has(globalId)) throw new Error(`ElementIndex: GlobalId ${globalId} names two elements.`);
      if (!(instanceCounts[element] >= 1)) {
        const count = instanceCounts[element];
        throw new Error(`ElementIndex: element ${globalId} needs at least one instance, got ${count}.`);
      }
      elementByGlobalId.set(globalId, element);
      firstInstances[element + 1] = firstInstances[element] + instanceCounts[element];
    });
    const elementByInstance = new Int32Array(firstInstances[globalIds.length]);
    for (let element = 0; element < globalIds.length; element++) {
      elementByInstance.fill(element, firstInstances[element], firstInstances[element + 1]);
    }
    return new ElementIndex(globalIds, elementByGlobalId, firstInstances, elementByInstance);
  }

  get elementCount(): number {
    return this.globalIds.length;
  }

  get instanceCount(): number {
    return this.elementByInstance.length;
  }

  /** Element number of a GlobalId, or −1. */
  elementOf(globalId: string): number {
    return this.elementByGlobalId.get(globalId) ?? -1;
  }

  has(globalId: string): boolean {
    return this.elementByGlobalId.has(globalId);
  }

  firstInstanceOf(element: number): number {
    return this.firstInstances[element];
  }

  /** One past the element's last instance. */
  endInstanceOf(element: number): number {
    return this.firstInstances[element + 1];
  }

  /** The GlobalId an instance draws, or null for an id outside the batch. */
  globalIdOfInstance(instanceId: number): string | null {
    if (!Number.isInteger(instanceId) || instanceId < 0 || instanceId >= this.elementByInstance.length) return null;
    return this.globalIds[this.elementByInstance[instanceId]];
  }

  /** Element numbers of those GlobalIds this index holds; the others are skipped. */
  elementsOf(globalIds: Iterable<string>): number[] {
    const elements: number[] = [];
    for (const globalId of globalIds) {
      const element = this.elementByGlobalId.get(globalId);
      if (element !== undefined) elements.push(element);
    }
    return elements;
  }
}
