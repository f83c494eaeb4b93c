import { plainAddPlaceholder } from '@signpdf/placeholder-plain';
import { P12Signer } from '@signpdf/signer-p12';
import { SignPdf } from '@signpdf/signpdf';

export interface SignatureDetails {
  /** Why the document is signed, shown by PDF readers. */
  reason: string;
  /** Signer's name as readers show it. */
  name: string;
  location: string;
  contactInfo: string;
  signingTime: Date;
}

/** Room for the PKCS#7 blob (bytes): enough for a chain of three 4096-bit certificates. */
const SIGNATURE_LENGTH = 12_288;

/**
 * Adds a signature field to a finished PDF (incremental update) and fills it with a detached PKCS#7
 * signature over every byte outside the signature itself (adbe.pkcs7.detached, SHA-256).
 */
export async function signPdf(pdf: Buffer, p12: Buffer, passphrase: string, details: SignatureDetails): Promise<Buffer> {
  const withPlaceholder = plainAddPlaceholder({
    pdfBuffer: pdf,
    reason: details.reason,
    name: details.name,
    location: details.location,
    contactInfo: details.contactInfo,
    signingTime: details.signingTime,
    signatureLength: SIGNATURE_LENGTH,
    appName: 'Meritline',
  });
  const signer = new P12Signer(p12, { passphrase });
  return new SignPdf().sign(withPlaceholder, signer, details.signingTime);
}
