// gzip → bytes with the browser's own DecompressionStream (also in Node 20, for the tests).

/** A gzip body that does not decompress; the message is for a person. */
export class GunzipError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'GunzipError';
  }
}

/**
 * Decompresses gzip bytes (RFC 1952) with `DecompressionStream('gzip')`.
 * @throws GunzipError when the bytes are not a whole gzip stream
 */
export async function gunzipBytes(bytes: Uint8Array): Promise<Uint8Array> {
  try {
    // Copy into a plain ArrayBuffer-backed view: Response wants a BufferSource it owns.
    const body = new Response(new Uint8Array(bytes)).body;
    if (!body) return new Uint8Array(0);
    const stream = body.pipeThrough(new DecompressionStream('gzip'));
    return new Uint8Array(await new Response(stream).arrayBuffer());
  } catch (error) {
    const why = error instanceof Error ? error.message : String(error);
    throw new GunzipError(`The downloaded model is damaged (it does not decompress: ${why}).`);
  }
}

/** Whether bytes start with the gzip magic number 1f 8b (RFC 1952, section 2.3.1). */
export const isGzip = (bytes: Uint8Array): boolean =>
  bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
