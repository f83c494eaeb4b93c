import { Inject, Injectable, Logger, ServiceUnavailableException, type OnModuleInit } from '@nestjs/common';
import { createHash, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { appConfig, type AppConfigType } from '../../config/app.config.js';
import { createSelfSignedP12, readP12 } from './self-signed-certificate.js';
import { signPdf, type SignatureDetails } from './sign-pdf.js';

/** A signed PDF with the SHA-256 and size it is stored and checked by. */
export interface IssuedPdf {
  pdf: Buffer;
  sha256: string;
  sizeBytes: number;
}

interface LoadedCertificate {
  p12: Buffer;
  passphrase: string;
  commonName: string;
  selfSigned: boolean;
}

/**
 * The laboratory's signing certificate: the configured PKCS#12 file in production; in development and
 * tests a self-signed one, created on first start under the data directory and never committed.
 */
@Injectable()
export class LabCertificateService implements OnModuleInit {
  private readonly logger = new Logger(LabCertificateService.name);
  private certificate: LoadedCertificate | null = null;
  private problem: string | null = null;

  constructor(@Inject(appConfig.KEY) private readonly config: AppConfigType) {}

  onModuleInit(): void {
    try {
      this.certificate = this.config.signing.p12Path ? this.loadConfigured(this.config.signing.p12Path) : this.loadDevelopment();
    } catch (error) {
      this.problem = (error as Error).message;
      this.logger.error(`Validation reports cannot be signed: ${this.problem}`);
    }
  }

  get signerName(): string | null {
    return this.certificate?.commonName ?? null;
  }

  /** Signs a finished PDF, or refuses with the reason when no usable certificate is configured. */
  async sign(pdf: Buffer, details: Omit<SignatureDetails, 'name'>): Promise<Buffer> {
    if (!this.certificate) {
      throw new ServiceUnavailableException(
        `The report cannot be signed, so it was not issued: ${this.problem ?? 'no signing certificate'}.`,
      );
    }
    return signPdf(pdf, this.certificate.p12, this.certificate.passphrase, { ...details, name: this.certificate.commonName });
  }

  /** Signs a document the laboratory issues: its name as the location, its verify page as the contact. */
  async issue(unsigned: Buffer, reason: string, signingTime: Date): Promise<IssuedPdf> {
    const pdf = await this.sign(unsigned, {
      reason,
      location: this.config.laboratoryName,
      contactInfo: `${this.config.publicUrl}/verify`,
      signingTime,
    });
    return { pdf, sha256: createHash('sha256').update(pdf).digest('hex'), sizeBytes: pdf.length };
  }

  private loadConfigured(path: string): LoadedCertificate {
    let p12: Buffer;
    try {
      p12 = readFileSync(path);
    } catch (error) {
      throw new Error(`the certificate file SIGNING_P12_PATH (${path}) cannot be read: ${(error as Error).message}`, { cause: error });
    }
    const passphrase = this.config.signing.p12Passphrase;
    try {
      const summary = readP12(p12, passphrase);
      if (summary.notAfter < new Date())
        this.logger.warn(`The signing certificate "${summary.commonName}" expired on ${summary.notAfter.toISOString()}.`);
      return { p12, passphrase, commonName: summary.commonName, selfSigned: false };
    } catch (error) {
      throw new Error(`the certificate file ${path} cannot be opened with SIGNING_P12_PASSPHRASE: ${(error as Error).message}`, {
        cause: error,
      });
    }
  }

  private loadDevelopment(): LoadedCertificate {
    if (this.config.env === 'production') {
      throw new Error('no laboratory certificate is configured; set SIGNING_P12_PATH and SIGNING_P12_PASSPHRASE');
    }
    const dir = join(this.config.dataDir, 'signing');
    const file = join(dir, 'lab-certificate.p12');
    const passphraseFile = join(dir, 'lab-certificate.passphrase');
    if (!existsSync(file) || !existsSync(passphraseFile)) {
      mkdirSync(dir, { recursive: true });
      const passphrase = randomBytes(24).toString('base64url');
      writeFileSync(passphraseFile, passphrase, { mode: 0o600 });
      writeFileSync(file, createSelfSignedP12(this.config.laboratoryName, passphrase), { mode: 0o600 });
      this.logger.log(`Created a self-signed development signing certificate in ${dir}.`);
    }
    const p12 = readFileSync(file);
    const passphrase = readFileSync(passphraseFile, 'utf8').trim();
    return { p12, passphrase, commonName: readP12(p12, passphrase).commonName, selfSigned: true };
  }
}
