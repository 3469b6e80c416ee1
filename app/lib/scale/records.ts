/**
 * Constructors for the results the preview builds by the thousand on every keystroke (a marker's
 * point, its labels, its place, its walking figures).
 *
 * Why not object literals: V8 gives each literal an allocation site, and once it sees one batch of
 * a site's objects all survive a collection — as the preview's first result does, kept on screen —
 * it "pretenures" the site for good: every later keystroke's objects from it are allocated in the
 * old generation, where they are slower to make and are only collected by the costly full
 * collections. Measured on the composer benchmark (node --trace-gc, --trace-pretenuring-statistics):
 * with literals the heap grew by about 6 MB per young collection, each taking 5–8 ms; with these
 * constructors it stays level, about 1 ms per collection. `new` of a function has no allocation site.
 *
 * The objects are plain all the same: the constructors' prototype is Object.prototype, so JSON,
 * structuredClone and React Router's data encoding treat them as object literals.
 */

/** A constructor of plain objects (prototype Object.prototype) from a function that sets the fields. */
export function plainRecord<A extends unknown[], T extends object>(init: (this: T, ...args: A) => void): new (...args: A) => T {
  (init as unknown as { prototype: object }).prototype = Object.prototype;
  return init as unknown as new (...args: A) => T;
}
