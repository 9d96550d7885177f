/*
 * Numbers in shard results, as JSON carries them. JSON writes NaN as null
 * and -0 as 0; a shard's values travel through JSON (a job queue's payload),
 * and the merge must give one run's result bit for bit, so a negative zero
 * is written as the string "-0" and a value that is not a number (a point or
 * row not computed) as null, and both are read back here.
 */

/** A value in a shard result: null where not computed, "-0" for a negative zero. */
export type ShardValue = number | null | "-0";

/** The JSON-safe form of one value. `missing` marks entries not computed (written null). */
export function toShardValue(v: number, missing = v !== v): ShardValue {
  return missing ? null : Object.is(v, -0) ? "-0" : v;
}

/** A value from a shard result: null (not computed) is NaN again, "-0" is -0. */
export function fromShardValue(v: ShardValue | undefined): number {
  return v === "-0" ? -0 : typeof v === "number" ? v : NaN;
}

/** The JSON-safe form of a range of values. */
export function toShardValues(a: Float64Array, start = 0, end = a.length): ShardValue[] {
  return Array.from(a.subarray(start, end), (v) => toShardValue(v));
}
