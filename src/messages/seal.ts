/**
 * The words of sealing and verifying: the verdict that `furrow verify` prints and that the
 * report and the page's hand-off panel list (src/seal/verify-text.ts).
 */

/** How a claim stands on verifying, as its line says it. */
export type ClaimStanding = 'held-now-only' | 'no-longer' | 'never' | 'error' | 'gone' | 'new';

export const sealMsg = {
  notSealed: (path: string, problem: string | null) => `${path}: ${problem ?? 'not sealed.'}`,
  otherEngine: (sealedBy: string | null, now: string) =>
    `Engine: sealed by ${sealedBy ?? 'an unnamed engine'}, recomputed by ${now}; results may differ in their last digits for that reason alone.`,
  sectionProblem: (problem: string) => `Sealed section: ${problem}`,
  fingerprintMatches: (digest: string) => `Fingerprint: matches (sha256:${digest}).`,
  fingerprintDiffers: (digest: string) => `Fingerprint: DIFFERS (now sha256:${digest}).`,
  valuesHeading: () => 'Values:',
  atCell: (cell: number) => `(cell ${cell})`,
  claimsHeading: (holding: number, total: number) => `Claims: ${holding} of ${total} hold as sealed.`,
  claimWho: (name: string, cell: number | null) => `(${name}${cell === null ? '' : `, cell ${cell}`})`,
  claimStanding: (standing: ClaimStanding, detail: string) => {
    switch (standing) {
      case 'held-now-only': return 'holds now, but did not when sealed';
      case 'no-longer': return 'NO LONGER HOLDS';
      case 'never': return 'does not hold (nor did it when sealed)';
      case 'error': return `cannot be checked: ${detail}`;
      case 'gone': return 'is gone: it is no longer in the document';
      case 'new': return `is new: it ${detail}`;
    }
  },
  verified: () => 'Verified: every value is the same, bit for bit, and every claim holds.',
  notVerified: (reasons: readonly string[]) => `NOT VERIFIED: ${reasons.join('; ')}.`,
  reasonEngine: () => 'another engine version',
  reasonSection: (problems: number) => `${problems} problems with the sealed section`,
  reasonFingerprint: () => 'the fingerprint differs',
  reasonValues: (changed: number) => `${changed} ${changed === 1 ? 'value differs' : 'values differ'}`,
  reasonClaims: (failing: number) => `${failing} ${failing === 1 ? 'claim does' : 'claims do'} not hold as sealed`,
} as const;
