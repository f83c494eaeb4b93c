import { generateKeyPairSync, randomBytes } from 'node:crypto';
import forge from 'node-forge';

/** X.520 upper bound for a common name. */
const MAX_COMMON_NAME = 64;

/**
 * A self-signed signing certificate as PKCS#12 (RSA 2048, SHA-256, 3DES-protected), for development
 * and tests only: readers will call its issuer unknown, which is the honest answer.
 */
export function createSelfSignedP12(laboratoryName: string, passphrase: string, validYears = 10): Buffer {
  const { privateKey, publicKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  const key = forge.pki.privateKeyFromPem(privateKey.export({ type: 'pkcs8', format: 'pem' }).toString());
  const cert = forge.pki.createCertificate();
  cert.publicKey = forge.pki.publicKeyFromPem(publicKey.export({ type: 'spki', format: 'pem' }).toString());
  cert.serialNumber = `01${randomBytes(15).toString('hex')}`;
  cert.validity.notBefore = new Date(Date.now() - 60_000);
  cert.validity.notAfter = new Date(Date.now() + validYears * 365.25 * 86_400_000);
  const subject = [
    { name: 'commonName', value: laboratoryName.slice(0, MAX_COMMON_NAME) },
    { name: 'organizationName', value: laboratoryName.slice(0, MAX_COMMON_NAME) },
    { name: 'organizationalUnitName', value: 'Meritline development signing (self-signed)' },
  ];
  cert.setSubject(subject);
  cert.setIssuer(subject);
  cert.setExtensions([
    { name: 'basicConstraints', cA: false },
    { name: 'keyUsage', digitalSignature: true, nonRepudiation: true },
    { name: 'subjectKeyIdentifier' },
  ]);
  cert.sign(key, forge.md.sha256.create());
  const p12 = forge.pkcs12.toPkcs12Asn1(key, [cert], passphrase, {
    algorithm: '3des',
    friendlyName: laboratoryName.slice(0, MAX_COMMON_NAME),
  });
  return Buffer.from(forge.asn1.toDer(p12).getBytes(), 'binary');
}

export interface CertificateSummary {
  commonName: string;
  notAfter: Date;
}

/** Opens a PKCS#12 file with its passphrase and checks it holds a private key and a certificate. */
export function readP12(p12: Buffer, passphrase: string): CertificateSummary {
  const parsed = forge.pkcs12.pkcs12FromAsn1(forge.asn1.fromDer(p12.toString('binary')), passphrase);
  const certificate = parsed.getBags({ bagType: forge.pki.oids.certBag })[forge.pki.oids.certBag]?.[0]?.cert;
  const key =
    parsed.getBags({ bagType: forge.pki.oids.pkcs8ShroudedKeyBag })[forge.pki.oids.pkcs8ShroudedKeyBag]?.[0]?.key ??
    parsed.getBags({ bagType: forge.pki.oids.keyBag })[forge.pki.oids.keyBag]?.[0]?.key;
  if (!certificate || !key) throw new Error('the PKCS#12 file holds no certificate with its private key');
  return {
    commonName: String(certificate.subject.getField('CN')?.value ?? 'unnamed certificate'),
    notAfter: certificate.validity.notAfter,
  };
}
