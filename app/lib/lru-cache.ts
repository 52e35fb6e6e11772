// A small least-recently-used table keyed by text: the scatter runs, the dashboard's verdicts and the
// plan editor's rendered pages each keep one. A Map keeps insertion order, so the oldest entry is first.
export class LruCache<V> {
  private readonly table = new Map<string, V>();
  constructor(readonly capacity: number) {}
  get size(): number {
    return this.table.size;
  }
  get(key: string): V | undefined {
    const v = this.table.get(key);
    if (v === undefined) return undefined;
    // a Map keeps insertion order: move the hit to the newest end
    this.table.delete(key);
    this.table.set(key, v);
    return v;
  }
  set(key: string, value: V): void {
    this.table.delete(key);
    this.table.set(key, value);
    while (this.table.size > this.capacity) this.table.delete(this.table.keys().next().value as string);
  }
  clear(): void {
    this.table.clear();
  }
}
