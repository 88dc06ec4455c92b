import { deflateSync } from 'node:zlib';
import { cleanFileName, detectConsentDocumentType } from './document-type';

// Smallest valid files built by hand from the format specifications named in document-type.ts.
const PDF = Buffer.from('%PDF-1.4\n1 0 obj << >> endobj\ntrailer << >>\n%%EOF\n', 'latin1');
const JPEG = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00]);
function png(): Buffer {
  // Signature + IHDR for a 1×1 grey image + IDAT (zlib via node:zlib) + IEND; CRCs are not checked here.
  const chunk = (type: string, data: Buffer) => {
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    return Buffer.concat([length, Buffer.from(type, 'latin1'), data, Buffer.alloc(4)]);
  };
  const ihdr = Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 0, 0, 0, 0]);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(Buffer.from([0, 0]))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

describe('detectConsentDocumentType', () => {
  it.each([
    ['PDF', PDF, 'application/pdf'],
    ['PNG', png(), 'image/png'],
    ['JPEG', JPEG, 'image/jpeg'],
  ])('recognises %s by its first bytes', (_name, bytes, mimeType) => {
    expect(detectConsentDocumentType(bytes)?.mimeType).toBe(mimeType);
  });

  it.each([
    ['plain text', Buffer.from('I agree to my writing being used.')],
    ['a ZIP archive (PK\\3\\4)', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00])],
    ['a GIF image', Buffer.from('GIF89a', 'latin1')],
    ['a PNG signature cut short', Buffer.from([0x89, 0x50, 0x4e, 0x47])],
    ['an empty file', Buffer.alloc(0)],
    ['"%PDF" without the dash', Buffer.from('%PDF1.4', 'latin1')],
  ])('refuses %s', (_name, bytes) => {
    expect(detectConsentDocumentType(bytes)).toBeNull();
  });
});

describe('cleanFileName', () => {
  it('keeps the last path segment without quotes or control characters', () => {
    expect(cleanFileName('C:\\scans\\consent "R".pdf', 'x.pdf')).toBe('consent R.pdf');
    expect(cleanFileName('../../etc/passwd\n', 'x.pdf')).toBe('passwd');
  });

  it('falls back when nothing is left, and cuts long names to 200 characters', () => {
    expect(cleanFileName('', 'consent-form.pdf')).toBe('consent-form.pdf');
    expect(cleanFileName(undefined, 'consent-form.pdf')).toBe('consent-form.pdf');
    expect(cleanFileName('a'.repeat(300), 'x')).toHaveLength(200);
  });
});
