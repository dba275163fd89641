import type { ChunkOutput, RunResultData } from "./kinds";

/*
 * A run's result columns as bytes: float64 in little-endian order, one column after the other, in
 * the order of `meta.columns`. Bytes keep every double (and NaN, which JSON cannot carry) exactly.
 */

export interface ColumnInfo {
  name: string;
  length: number;
}

export function encodeResult(result: RunResultData): { meta: Record<string, unknown>; data: Buffer } {
  const columns: ColumnInfo[] = Object.entries(result.columns).map(([name, col]) => ({ name, length: col.length }));
  const total = columns.reduce((s, c) => s + c.length, 0);
  const data = Buffer.alloc(total * 8);
  let offset = 0;
  for (const [, col] of Object.entries(result.columns)) {
    for (let i = 0; i < col.length; i++) data.writeDoubleLE(col[i]!, offset + i * 8);
    offset += col.length * 8;
  }
  return { meta: { ...result.meta, columns }, data };
}

/** Columns for a JSON answer: every double in its shortest round-trip form, NaN (which JSON lacks) as null. */
export function columnsAsJson(columns: Record<string, Float64Array>): Record<string, (number | null)[]> {
  const out: Record<string, (number | null)[]> = {};
  for (const [name, col] of Object.entries(columns)) out[name] = Array.from(col, (v) => (Number.isNaN(v) ? null : v));
  return out;
}

export function decodeResult(meta: Record<string, unknown>, data: Uint8Array): Record<string, Float64Array> {
  const columns = (meta.columns ?? []) as ColumnInfo[];
  const view = new DataView(data.buffer, data.byteOffset, data.byteLength);
  const out: Record<string, Float64Array> = {};
  let offset = 0;
  for (const c of columns) {
    const col = new Float64Array(c.length);
    for (let i = 0; i < c.length; i++) col[i] = view.getFloat64(offset + i * 8, true);
    offset += c.length * 8;
    out[c.name] = col;
  }
  return out;
}

/**
 * One finished chunk as a checkpoint: its columns as bytes (as a result), its flags, deviation and
 * warnings in the JSON beside them, so a resumed run assembles the same result bit for bit.
 */
export function encodeChunk(output: ChunkOutput): { meta: Record<string, unknown>; data: Buffer } {
  const { meta, data } = encodeResult({ columns: output.columns, meta: {} });
  return {
    meta: {
      ...meta,
      flags: output.flags ? Array.from(output.flags) : null,
      deviation: output.deviation ?? null,
      warnings: output.warnings,
    },
    data,
  };
}

export function decodeChunk(meta: Record<string, unknown>, data: Uint8Array): ChunkOutput {
  const flags = meta.flags as number[] | null;
  const deviation = meta.deviation as number | null;
  return {
    columns: decodeResult(meta, data),
    ...(flags ? { flags: Uint8Array.from(flags) } : {}),
    ...(deviation === null ? {} : { deviation }),
    warnings: (meta.warnings ?? []) as string[],
  };
}
