import { inspect } from "node:util";

/*
 * vitest's toEqual / toStrictEqual compare a typed array element by element
 * through its generic iterable comparison, and then again as the array of
 * Object.entries: about 10 us per element here, so comparing two results of
 * a 1e6-point sweep took tens of seconds (tests/tools/progress-parallel's
 * sweep on the pool, 44 s at load 9). This tester gives the same answer for
 * two typed arrays that hold nothing but their elements: equal when they have
 * the same constructor and length and every element is the same by
 * Object.is (so NaN equals NaN and -0 differs from 0, as in vitest's own
 * comparison), in one plain loop. Anything else - other values, typed arrays
 * with properties of their own beside the elements, Buffers, DataViews - it
 * leaves to vitest (returns undefined).
 */

type Typed = Exclude<ArrayBufferView, DataView> & { readonly length: number; readonly [i: number]: number | bigint };

/** A typed array of a built-in kind with no own enumerable property besides its elements. */
function elementsOnly(a: unknown): a is Typed {
  if (!ArrayBuffer.isView(a) || a instanceof DataView) return false;
  const t = a as Typed;
  // util.inspect lists the properties beside the elements without listing the
  // elements (maxArrayLength 0): Object.keys would name every index first.
  const n = t.length;
  const bare = `${t.constructor.name}(${n}) ${n === 0 ? "[]" : `[ ... ${n} more item${n === 1 ? "" : "s"} ]`}`;
  return inspect(t, { maxArrayLength: 0, depth: 0 }) === bare;
}

export function typedArrayEquality(a: unknown, b: unknown): boolean | undefined {
  if (!elementsOnly(a) || !elementsOnly(b)) return undefined;
  if (a.constructor !== b.constructor || a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) return false;
  return true;
}
