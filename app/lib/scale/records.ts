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
 *
 * Each kind keeps a few objects of its shapes alive for good (`shapes`, made once when the module
 * loads, from fixed values). An object's shape (V8's map) is reached from the constructor only
 * weakly, and the engine drops the code it compiled for a shape when a full collection finds no
 * object of it alive — as it does on a server between requests, or in the composer benchmark's
 * collection before each block, which recompiled the per-marker code every round. The kept
 * objects hold field values of the kinds the real ones hold (fractions where they hold fractions,
 * null where they may hold null), so that they share their shapes.
 */

/** The objects that keep the records' shapes alive. */
const KEPT_SHAPES: object[] = [];

/** The kept objects (for tests/unit/scale/record-shapes.test.ts, which checks that they share the real results' shapes). */
export const keptShapes = (): readonly object[] => KEPT_SHAPES;

/**
 * A constructor of plain objects (prototype Object.prototype) from a function that sets the fields;
 * `shapes`: argument lists for one object of each shape the kind takes, kept alive for good.
 */
export function plainRecord<A extends unknown[], T extends object>(init: (this: T, ...args: A) => void, ...shapes: A[]): new (...args: A) => T {
  (init as unknown as { prototype: object }).prototype = Object.prototype;
  const Record = init as unknown as new (...args: A) => T;
  for (const args of shapes) KEPT_SHAPES.push(new Record(...args));
  return Record;
}
