/** Small integer ids for repeated strings (combination names), in order of first appearance. */
export class StringIds {
  private readonly ids = new Map<string, number>();
  readonly values: string[] = [];

  idOf(value: string): number {
    let id = this.ids.get(value);
    if (id === undefined) {
      id = this.values.length;
      this.ids.set(value, id);
      this.values.push(value);
    }
    return id;
  }
}
