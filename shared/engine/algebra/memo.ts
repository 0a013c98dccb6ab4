// A function of an object computed once per object, kept while the object lives (a WeakMap), for
// what a polynomial is asked again and again: its residues, its images, its values at one point.

export function onceEach<K extends object, T>(compute: (key: K) => T): (key: K) => T {
  const cache = new WeakMap<K, T>();
  return (key) => {
    if (cache.has(key)) return cache.get(key)!;
    const value = compute(key);
    cache.set(key, value);
    return value;
  };
}
