/**
 * SHA-256 as the seal uses it, against the published test vectors and Node's crypto.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runningSha256, sha256Bytes, sha256Text } from '../../src/seal/digest.ts';
import { ENGINE_VERSION } from '../../src/seal/version.ts';

describe('sha256', () => {
  it('gives the FIPS 180-4 example digests', () => {
    // source: NIST, FIPS 180-4 examples (SHA256.pdf, "abc" and the two-block message) and the
    // empty-message vector of the NIST CAVP SHA-256 short messages (from memory)
    expect(sha256Text('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Text('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
    expect(sha256Text('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });
  it('agrees with Node crypto on any text and in pieces', () => {
    // source: Node 20 crypto.createHash('sha256') as the reference library
    fc.assert(
      fc.property(fc.array(fc.string({ unit: 'binary' }), { maxLength: 6 }), (pieces) => {
        const whole = pieces.join('');
        const ref = createHash('sha256').update(whole, 'utf8').digest('hex');
        expect(sha256Text(whole)).toBe(ref);
        const run = runningSha256();
        for (const p of pieces) run.add(p);
        expect(run.finish()).toBe(ref);
        expect(sha256Bytes(new TextEncoder().encode(whole))).toBe(ref);
      }),
      { numRuns: 500 },
    );
  });
});

describe('engine version', () => {
  it('is the package version', () => {
    const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };
    expect(ENGINE_VERSION).toBe(pkg.version);
  });
});
