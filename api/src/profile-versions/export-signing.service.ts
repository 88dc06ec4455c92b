import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { ProfileFileAuthenticity, ProfileFileSigner } from '@keyloom/shared';
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { AppConfig } from '../config/app-config';

// The signature on exported .klprofile files: HMAC-SHA-256 (RFC 2104; FIPS 198-1) from node:crypto
// over every byte before the signature (shared/src/engine/profile/profile-file.ts, layout 2).
// The key: EXPORT_SIGNING_KEY when set (its UTF-8 bytes); otherwise 32 random bytes
// (crypto.randomBytes) made the first time a file is exported or checked and kept in the database
// table app_settings, so every API process signs and checks with the same key, and the key is never
// in the repository's files. Checking compares in constant time (crypto.timingSafeEqual), so the
// answer's timing does not tell how much of a forged signature was right.

export const EXPORT_SIGNING_KEY_SETTING = 'export-signing-key';

/** HMAC-SHA-256 of `bytes` under `key` (32 bytes). */
export function exportSignature(key: Uint8Array, bytes: Uint8Array): Uint8Array {
  return new Uint8Array(createHmac('sha256', key).update(bytes).digest());
}

@Injectable()
export class ExportSigningService {
  private stored: Promise<Buffer> | null = null;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly config: AppConfig,
  ) {}

  /** Signs a profile file being written (writeProfileFile's third argument). */
  async signer(): Promise<ProfileFileSigner> {
    const key = await this.key();
    return (bytes) => exportSignature(key, bytes);
  }

  /** Whether this clinic's key made `signature` over `signedBytes`; 'unsigned' when there is none. */
  async authenticity(
    signature: Uint8Array | null,
    signedBytes: Uint8Array,
  ): Promise<ProfileFileAuthenticity> {
    if (!signature) return 'unsigned';
    const expected = exportSignature(await this.key(), signedBytes);
    const same = expected.length === signature.length && timingSafeEqual(expected, signature);
    return same ? 'this-clinic' : 'other';
  }

  private key(): Promise<Buffer> {
    const fromEnv = this.config.exportSigningKey;
    if (fromEnv) return Promise.resolve(Buffer.from(fromEnv, 'utf8'));
    this.stored ??= this.storedKey().catch((error: unknown) => {
      this.stored = null; // a database hiccup is not remembered
      throw error;
    });
    return this.stored;
  }

  /** The key kept in app_settings, made on first use; concurrent first uses agree on one. */
  private async storedKey(): Promise<Buffer> {
    await this.dataSource.query(
      `INSERT INTO app_settings (name, value) VALUES ($1, $2) ON CONFLICT (name) DO NOTHING`,
      [EXPORT_SIGNING_KEY_SETTING, randomBytes(32).toString('base64')],
    );
    const rows = await this.dataSource.query<{ value: string }[]>(
      `SELECT value FROM app_settings WHERE name = $1`,
      [EXPORT_SIGNING_KEY_SETTING],
    );
    return Buffer.from(rows[0].value, 'base64');
  }
}
