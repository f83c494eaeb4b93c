import { createSecretKey, type KeyObject } from 'node:crypto';

/**
 * The signing secret as a key object. Given the plain string, jsonwebtoken first tries to read it as a PEM public
 * key on every verification and builds the secret key only after that attempt throws.
 */
export function jwtVerificationKey(secret: string): KeyObject {
  return createSecretKey(Buffer.from(secret));
}
