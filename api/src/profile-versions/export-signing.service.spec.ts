import { writeProfileFile, readProfileFile, type ProfileFileHeader } from '@keyloom/shared';
import { createHmac } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { AppConfig } from '../config/app-config';
import { validateEnv } from '../config/env.schema';
import { ExportSigningService } from './export-signing.service';

// EXPORT_SIGNING_KEY set: the key is its UTF-8 bytes and the database is never asked.
const ENV_KEY = 'an invented export key for this test, 48 chars..';
const noDatabase = {
  query: () => Promise.reject(new Error('the database must not be asked when EXPORT_SIGNING_KEY is set')),
} as unknown as DataSource;
const service = (key: string | undefined) =>
  new ExportSigningService(noDatabase, { exportSigningKey: key } as AppConfig);

const header = { format: 'keyloom-profile', client: { pseudonym: 'R. Ashby' } } as ProfileFileHeader;
const model = new Uint8Array([1, 2, 3, 4]);

describe('ExportSigningService with EXPORT_SIGNING_KEY', () => {
  it('signs with HMAC-SHA-256 of the key’s bytes, as node:crypto computes it (RFC 2104)', async () => {
    const file = writeProfileFile(header, model, await service(ENV_KEY).signer());
    const { signature, signedBytes } = readProfileFile(file);
    const expected = createHmac('sha256', Buffer.from(ENV_KEY, 'utf8')).update(signedBytes).digest();
    expect(Buffer.from(signature ?? []).equals(expected)).toBe(true);
  });

  it('knows its own signature, not another key’s, and calls a file without one unsigned', async () => {
    const file = readProfileFile(writeProfileFile(header, model, await service(ENV_KEY).signer()));
    expect(await service(ENV_KEY).authenticity(file.signature, file.signedBytes)).toBe('this-clinic');
    expect(await service(`${ENV_KEY}!`).authenticity(file.signature, file.signedBytes)).toBe('other');
    // A signature of the wrong length is refused before the constant-time comparison (which throws on it).
    expect(await service(ENV_KEY).authenticity(new Uint8Array(5), file.signedBytes)).toBe('other');
    expect(await service(ENV_KEY).authenticity(null, file.signedBytes)).toBe('unsigned');
  });

  it('refuses a key shorter than 32 characters at start-up, without echoing it', () => {
    expect(() => validateEnv({ EXPORT_SIGNING_KEY: 'short-key-value' })).toThrow(
      /EXPORT_SIGNING_KEY: Use at least 32 random characters\.$/m,
    );
    expect(() => validateEnv({ EXPORT_SIGNING_KEY: 'short-key-value' })).not.toThrow(/short-key-value/);
    expect(validateEnv({ EXPORT_SIGNING_KEY: ENV_KEY }).EXPORT_SIGNING_KEY).toBe(ENV_KEY);
  });
});
