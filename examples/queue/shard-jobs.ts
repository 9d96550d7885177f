/**
 * What the producer and the worker processes of the queue example agree on:
 * the queue's name, a job's data and return value, the binary form of a
 * shard's numbers, how a library error crosses the queue, and the example's
 * own error codes. Nothing here is part of the library (which never imports
 * bullmq); the library's side is planShards / runShard / mergeShards.
 */
import type { ErrorCode, FormulaErrorFields } from "../../src/core/errors.js";
import { FormulaError } from "../../src/core/errors.js";
import type { CollectedNotes } from "../../src/tools/notes.js";
import { fromShardValue, type ShardValue, toShardValue } from "../../src/tools/shard-values.js";
import type { Shard, ShardResult, SweepShardRequest, SweepShardResult, ToleranceShardRequest, ToleranceShardResult } from "../../src/tools/shards.js";

/** The queue every producer and worker use unless told otherwise (env QUEUE). */
export const DEFAULT_QUEUE = "emquant-shards";

/** Where a worker finds Redis unless told otherwise (env REDIS_URL). */
export const DEFAULT_REDIS_URL = "redis://127.0.0.1:6379";

/** How long a shard's numbers stay in Redis when no producer collects them (a producer that died). */
export const DEFAULT_RESULT_TTL_MS = 3_600_000;

/** BullMQ's connection options from a redis:// URL (BullMQ opens its own connections). */
export function connectionOf(url: string): { host: string; port: number; username?: string; password?: string; db?: number } {
  const u = new URL(url);
  if (u.protocol !== "redis:") throw new Error(`REDIS_URL must be redis://host:port, got ${JSON.stringify(url)}`);
  const db = u.pathname.length > 1 ? Number(u.pathname.slice(1)) : undefined;
  return {
    host: u.hostname || "127.0.0.1",
    port: u.port ? Number(u.port) : 6379,
    ...(u.username ? { username: decodeURIComponent(u.username) } : {}),
    ...(u.password ? { password: decodeURIComponent(u.password) } : {}),
    ...(db !== undefined && Number.isInteger(db) ? { db } : {}),
  };
}

/** A job: one shard, plus where its worker puts the numbers. */
export interface ShardJobData {
  /** The producer's run id: every job and result key of one request carries it. */
  readonly run: string;
  readonly shard: Shard;
  /** Redis key of the shard's numbers (binary, see encodeShard). */
  readonly resultKey: string;
}

/** A job's return value: small JSON. The numbers themselves are in Redis under resultKey. */
export interface ShardJobReturn {
  /** Bytes stored under resultKey. */
  readonly bytes: number;
  /** Which worker computed it (host and process id). */
  readonly by: string;
  /** Milliseconds in runShard. */
  readonly ms: number;
  /** Tolerance: the notes of the shard's samples, and how many values it computed. */
  readonly notes?: CollectedNotes;
  readonly values?: number;
  /** Sweep: points not computed, and how many output components. */
  readonly notComputed?: number;
  readonly components?: number;
}

/*
 * Why binary in a Redis key, not the job's return value: a return value is
 * JSON, stored in the job's hash and copied once more into the queue's event
 * stream (BullMQ's "completed" event carries it). A tolerance shard's samples
 * as JSON numbers are about 19 bytes each (base64 of the Float64Array: 10.7),
 * twice over; written as a Float64Array's bytes into a key of its own they are
 * 8 bytes each, once, and no JSON parse of megabytes runs in the producer.
 * Doubles are copied bit for bit, NaN included (a sweep's "not computed"); in
 * the result objects those are null and a negative zero "-0" (ShardValue).
 */

/** The numbers of a shard result as bytes: tolerance values; or sweep values, each component, then the computed flags. */
export function encodeShard(result: ShardResult): { blob: Buffer; meta: Omit<ShardJobReturn, "bytes" | "by" | "ms"> } {
  if (result.shard.request.kind === "tolerance") {
    const r = result as ToleranceShardResult;
    const values = Float64Array.from(r.values, fromShardValue);
    return { blob: Buffer.from(values.buffer, values.byteOffset, values.byteLength), meta: { notes: r.notes, values: values.length } };
  }
  const r = result as SweepShardResult;
  const n = r.values.length;
  const columns = [r.values, ...(r.components ?? [])];
  const out = Buffer.alloc(columns.length * n * 8 + n);
  const doubles = new Float64Array(out.buffer, out.byteOffset, columns.length * n);
  columns.forEach((c, j) => {
    for (let i = 0; i < n; i++) doubles[j * n + i] = fromShardValue(c[i]);
  });
  out.set(r.computed, columns.length * n * 8);
  return { blob: out, meta: { notComputed: r.notComputed, components: r.components?.length ?? 0 } };
}

function doublesOf(blob: Buffer, from: number, count: number): ShardValue[] {
  // Copy into an aligned buffer: a Buffer from Redis may start at any byte offset.
  const aligned = new Float64Array(count);
  new Uint8Array(aligned.buffer).set(blob.subarray(from, from + count * 8));
  return Array.from(aligned, (v) => toShardValue(v));
}

/** The shard result from its bytes and the job's return value (the inverse of encodeShard). */
export function decodeShard(shard: Shard, blob: Buffer, meta: ShardJobReturn): ShardResult {
  if (shard.request.kind === "tolerance") {
    const count = meta.values ?? 0;
    if (blob.length !== count * 8) throw new ShardQueueError("result_corrupt", shard, `${blob.length} bytes for ${count} values`);
    const result: ToleranceShardResult = { shard: shard as Shard<ToleranceShardRequest>, values: doublesOf(blob, 0, count), notes: meta.notes! };
    return result;
  }
  const n = shard.end - shard.start;
  const columns = 1 + (meta.components ?? 0);
  if (blob.length !== columns * n * 8 + n) throw new ShardQueueError("result_corrupt", shard, `${blob.length} bytes for ${n} points`);
  const result: SweepShardResult = {
    shard: shard as Shard<SweepShardRequest>,
    values: doublesOf(blob, 0, n),
    ...(columns > 1 ? { components: Array.from({ length: columns - 1 }, (_, j) => doublesOf(blob, (j + 1) * n * 8, n)) } : {}),
    computed: Array.from(blob.subarray(columns * n * 8)),
    notComputed: meta.notComputed ?? 0,
  };
  return result;
}

/** A library error as it crosses the queue (a failed job's reason is a string). */
const FORMULA_ERROR = "FormulaError ";

export function formulaErrorReason(e: FormulaError): string {
  const fields: FormulaErrorFields & { code: ErrorCode } = {
    code: e.code, formula: e.formula, input: e.input, expected: e.expected, received: e.received, rule: e.rule, detail: e.detail,
    ...(typeof e.value === "number" || typeof e.value === "string" ? { value: e.value } : {}),
  };
  return FORMULA_ERROR + JSON.stringify(fields);
}

/** The FormulaError a failed job carried, or undefined when it failed otherwise. */
export function formulaErrorFrom(reason: string | undefined, shard: Shard): FormulaError | undefined {
  if (!reason?.startsWith(FORMULA_ERROR)) return undefined;
  try {
    const { code, ...fields } = JSON.parse(reason.slice(FORMULA_ERROR.length)) as FormulaErrorFields & { code: ErrorCode };
    const where = `in shard ${shard.index + 1} of ${shard.count}, on a queue worker`;
    return new FormulaError(code, { ...fields, detail: fields.detail ? `${fields.detail}; ${where}` : where });
  } catch {
    return undefined;
  }
}

/**
 * The example's own failures, besides the library's FormulaError (which a
 * shard's worker passes on unchanged) and "cancelled":
 * - shard_failed: a shard failed on every attempt for a reason outside the
 *   library (a worker crashed or stalled too often, Redis refused a write...);
 * - timed_out: not every shard finished within the producer's time limit;
 * - result_missing / result_corrupt: a shard's numbers are gone from Redis
 *   (evicted, expired) or have the wrong length;
 * - redis_error: Redis could not be reached or refused a command (the
 *   original error is the cause).
 */
export type ShardQueueErrorCode = "shard_failed" | "timed_out" | "result_missing" | "result_corrupt" | "redis_error";

export class ShardQueueError extends Error {
  declare readonly code: ShardQueueErrorCode;
  /** The shard concerned (index from 0), when one is. */
  declare readonly shard: number | undefined;

  constructor(code: ShardQueueErrorCode, shard: Shard | undefined, detail: string, cause?: unknown) {
    const where = shard ? `shard ${shard.index + 1} of ${shard.count} (indices ${shard.start}..${shard.end - 1})` : "the queue run";
    const what = {
      shard_failed: `${where} failed on every attempt`,
      timed_out: `${where} did not finish in time`,
      result_missing: `the numbers of ${where} are not in Redis`,
      result_corrupt: `the numbers of ${where} have the wrong length`,
      redis_error: `Redis failed ${where}`,
    }[code];
    super(`${what}: ${detail}`, cause === undefined ? undefined : { cause });
    this.name = "ShardQueueError";
    this.code = code;
    this.shard = shard?.index;
  }
}
