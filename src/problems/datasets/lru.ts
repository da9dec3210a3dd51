/** A small least-recently-used cache (Map insertion order), for parsed data reused across builds. */
export class LruCache<V> {
  private readonly map = new Map<string, V>();

  constructor(private readonly capacity: number) {}

  get(key: string): V | undefined {
    const v = this.map.get(key);
    if (v !== undefined) {
      this.map.delete(key);
      this.map.set(key, v);
    }
    return v;
  }

  set(key: string, value: V): V {
    this.map.delete(key);
    this.map.set(key, value);
    while (this.map.size > this.capacity) this.map.delete(this.map.keys().next().value as string);
    return value;
  }

  /** The cached value, or `make()` stored under `key`. */
  getOrMake(key: string, make: () => V): V {
    return this.get(key) ?? this.set(key, make());
  }

  get size(): number {
    return this.map.size;
  }
}
