/**
 * A small least-recently-used cache of promises for things that never change once made (published
 * layout versions and what is derived from them). A failed load is forgotten, so the next asks again.
 */
export function immutableCache<K, V>(max: number, load: (key: K) => Promise<V>): (key: K) => Promise<V> {
  const cache = new Map<K, Promise<V>>();
  return (key) => {
    const hit = cache.get(key);
    if (hit) {
      cache.delete(key);
      cache.set(key, hit);
      return hit;
    }
    const loading = load(key);
    loading.catch(() => cache.delete(key));
    cache.set(key, loading);
    while (cache.size > max) cache.delete(cache.keys().next().value as K);
    return loading;
  };
}
