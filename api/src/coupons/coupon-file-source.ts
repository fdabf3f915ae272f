/**
 * Where an uploaded coupon file is read from: its size, and a new stream of its
 * bytes each time it is opened. The import reads the file several times (the
 * checks and the checksum, the rows, the stored copy), each time in chunks, so
 * memory is bounded by the chunk size, not by the file: the route's file is a
 * temporary file on disk; the seeds and tests give a Buffer they hold already.
 */
import { createReadStream } from 'node:fs';
import { Readable } from 'node:stream';

/** Bytes per read: a chunk of the file is what the import holds at a time (plus one parsed chunk of rows). */
export const READ_CHUNK_BYTES = 256 * 1024;

export interface CouponFileSource {
  size: number;
  /** A new stream of the file's bytes (Buffers), from the first byte. */
  open(): Readable;
}

export function fileSourceFromPath(path: string, size: number): CouponFileSource {
  return { size, open: () => createReadStream(path, { highWaterMark: READ_CHUNK_BYTES }) };
}

/** A Buffer as a source, in chunks of `chunkBytes` (small chunks let tests put a boundary where they want it). */
export function fileSourceFromBuffer(content: Buffer, chunkBytes = READ_CHUNK_BYTES): CouponFileSource {
  function* chunks() {
    for (let at = 0; at < content.length; at += chunkBytes) yield content.subarray(at, at + chunkBytes);
  }
  // object mode: each chunk comes out as it went in (a byte stream may join small ones)
  return { size: content.length, open: () => Readable.from(chunks()) };
}

/** The source's bytes re-cut into pieces of exactly `size` bytes (the last one shorter). */
export async function* fixedSizeChunks(source: CouponFileSource, size: number): AsyncGenerator<Buffer> {
  let parts: Buffer[] = [];
  let held = 0;
  for await (const chunk of source.open() as AsyncIterable<Buffer>) {
    let rest = chunk;
    while (held + rest.length >= size) {
      const take = size - held;
      parts.push(rest.subarray(0, take));
      yield Buffer.concat(parts, size);
      rest = rest.subarray(take);
      parts = [];
      held = 0;
    }
    if (rest.length) {
      parts.push(rest);
      held += rest.length;
    }
  }
  if (held) yield Buffer.concat(parts, held);
}
