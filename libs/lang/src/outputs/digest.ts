import { canonicalJson } from './canonical-json';
import { sha256HexOfText } from './sha256';
import type { SiftOutput } from './types';

/** Version of the digest recipe; bump if the canonical form ever changes. */
export const DIGEST_VERSION = 1;

/**
 * Canonical SHA-256 digest (hex) of a run's outputs: SHA-256 of the UTF-8 canonical JSON of
 * `{"digest":1,"outputs":[…]}`. Same outputs → same digest, in Node and in the browser.
 */
export function outputsDigest(outputs: readonly SiftOutput[]): string {
  return sha256HexOfText(canonicalJson({ digest: DIGEST_VERSION, outputs }));
}
