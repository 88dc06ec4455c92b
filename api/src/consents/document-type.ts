/** The consent-form formats Keyloom stores, recognised by their first bytes (never by name or header). */
export type ConsentDocumentType = {
  mimeType: 'application/pdf' | 'image/png' | 'image/jpeg';
  extension: string;
};

// Signatures from the format specifications: PDF files begin with the header "%PDF-" (ISO 32000-1
// §7.5.2); PNG with the 8-byte signature 89 50 4E 47 0D 0A 1A 0A (PNG spec / RFC 2083 §3.1); JPEG
// with the SOI marker FF D8 followed by the next marker's FF (ITU-T T.81, Annex B).
const SIGNATURES: ReadonlyArray<{ bytes: readonly number[]; type: ConsentDocumentType }> = [
  { bytes: [0x25, 0x50, 0x44, 0x46, 0x2d], type: { mimeType: 'application/pdf', extension: 'pdf' } },
  {
    bytes: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
    type: { mimeType: 'image/png', extension: 'png' },
  },
  { bytes: [0xff, 0xd8, 0xff], type: { mimeType: 'image/jpeg', extension: 'jpg' } },
];

/** The document's type from its magic bytes, or null when it is none of PDF, PNG, JPEG. */
export function detectConsentDocumentType(bytes: Uint8Array): ConsentDocumentType | null {
  const match = SIGNATURES.find(({ bytes: signature }) =>
    signature.every((byte, index) => bytes[index] === byte),
  );
  return match ? match.type : null;
}

/**
 * A file name safe to store and to send back in Content-Disposition: the last path segment, control
 * characters and quotes removed, at most 200 characters; `fallback` when nothing is left.
 */
export function cleanFileName(name: string | undefined, fallback: string): string {
  const base = (name ?? '').split(/[\\/]/).pop() ?? '';
  // Control characters are exactly what this pattern is for.
  // eslint-disable-next-line no-control-regex
  const unsafe = /[\u0000-\u001f\u007f"]/g;
  const cleaned = base.replace(unsafe, '').trim().slice(0, 200);
  return cleaned === '' ? fallback : cleaned;
}
