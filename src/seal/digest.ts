/**
 * SHA-256 (FIPS 180-4) of text as UTF-8, in lowercase hex, the same in Node, the page and
 * the worker (synchronous, so sealing and verifying need no promises). The hash itself is
 * @noble/hashes' audited implementation.
 */
import { sha256 } from '@noble/hashes/sha2.js';

const encoder = new TextEncoder();
const HEX = Array.from({ length: 256 }, (_, i) => i.toString(16).padStart(2, '0'));

/** Lowercase hex of bytes. */
export function hex(bytes: Uint8Array): string {
  let s = '';
  for (let i = 0; i < bytes.length; i++) s += HEX[bytes[i]!]!;
  return s;
}

/** SHA-256 of bytes, as 64 hex digits. */
export function sha256Bytes(bytes: Uint8Array): string {
  return hex(sha256(bytes));
}

/** SHA-256 of a text's UTF-8 bytes, as 64 hex digits. */
export function sha256Text(text: string): string {
  return hex(sha256(encoder.encode(text)));
}

/** A hash fed piece by piece (a long column's JSON without building one string of it). */
export interface RunningHash {
  add(text: string): void;
  /** The digest as 64 hex digits; the hash cannot be fed after this. */
  finish(): string;
}

/** A running SHA-256 of UTF-8 text. */
export function runningSha256(): RunningHash {
  const h = sha256.create();
  return {
    add: (text) => void h.update(encoder.encode(text)),
    finish: () => hex(h.digest()),
  };
}

/** UTF-8 bytes of a text. */
export function utf8(text: string): Uint8Array {
  return encoder.encode(text);
}
