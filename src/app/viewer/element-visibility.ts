/**
 * Which elements the 3D view shows. Three controls combine: a member filter (e.g. "only failing"; context
 * elements are not members and ignore it), elements hidden one by one, and an isolation that shows only its own
 * elements. Hiding wins over everything; an isolation overrides the filter and the context switch.
 */
export class ElementVisibility {
  private memberFilter: ReadonlySet<string> | null = null;
  private readonly hidden = new Set<string>();
  private isolated: ReadonlySet<string> | null = null;
  private contextShown = true;

  /** Shows only these members; null lets every member through. */
  filterMembers(globalIds: Iterable<string> | null): void {
    this.memberFilter = globalIds === null ? null : new Set(globalIds);
  }

  isolate(globalIds: Iterable<string>): void {
    this.isolated = new Set(globalIds);
  }

  hide(globalIds: Iterable<string>): void {
    for (const globalId of globalIds) this.hidden.add(globalId);
  }

  /** Undoes hiding and isolation; the member filter stays, since its own control still shows it on. */
  showAll(): void {
    this.hidden.clear();
    this.isolated = null;
  }

  get contextVisible(): boolean {
    return this.contextShown;
  }

  set contextVisible(visible: boolean) {
    this.contextShown = visible;
  }

  /** Takes a saved viewpoint's visibility as the whole truth: no filter, and its exceptions hidden or isolated. */
  restore(defaultVisible: boolean, exceptionGlobalIds: readonly string[]): void {
    this.memberFilter = null;
    this.showAll();
    if (defaultVisible) this.hide(exceptionGlobalIds);
    else this.isolate(exceptionGlobalIds);
  }

  /** Forgets everything, for a new model. */
  reset(): void {
    this.memberFilter = null;
    this.showAll();
  }

  isShown(globalId: string, context: boolean): boolean {
    if (this.hidden.has(globalId)) return false;
    if (this.isolated !== null) return this.isolated.has(globalId);
    return context ? this.contextShown : this.memberFilter === null || this.memberFilter.has(globalId);
  }
}
