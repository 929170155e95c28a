/**
 * The words of the HTML report (`furrow report`, and Report in the page): its headings, its
 * verdict, its claims and the captions of what it prints.
 */
import { JUDGEMENT } from './words.ts';

export const reportMsg = {
  liveInDoubt: () => 'A claim that reads this number does not hold.',
  headerWords: [
    ['author', 'Author'],
    ['date', 'Date'],
    ['field', 'Field'],
    ['contact', 'Contact'],
    ['summary', 'Summary'],
  ] as const,
  caution: () => 'Caution.',
  warningLead: () => 'Note:',
  notSealed: () => 'Not sealed.',
  notSealedText: () => 'This report shows the document as it computes now; no sealed values were checked.',
  fingerprintOfAll: (hex: string) => `Fingerprint of the cells and data files: sha256:${hex}`,
  fingerprint: (hex: string) => `Fingerprint: sha256:${hex}`,
  verified: () => 'Verified: every value recomputes to its sealed value, bit for bit, and every claim holds.',
  notVerified: () => 'Not verified: the document no longer computes what was sealed.',
  holds: () => 'Holds',
  doesNotHold: () => 'Does not hold',
  noClaims: () => 'The document states no claims.',
  allClaimsHold: (n: number) => `All ${n} claims hold.`,
  claimsFail: (failing: number, n: number) => `${failing} of ${n} claims do not hold.`,
  verificationHeading: () => 'Verification',
  claimsHeading: () => 'Claims',
  trialHeading: () => 'The trial',
  footer: (engine: string, file: string) =>
    `Computed by ${engine} from ${file}. This file carries the document itself; open it in Furrow to get the document back. ${JUDGEMENT}`,
  doubtNote: (claims: readonly string[]) => `Marked numbers are read by a claim that does not hold: ${claims.map((c) => `“${c}”`).join('; ')}.`,
  anovaCaption: () => 'Analysis of variance',
  anovaHeads: () => ['source', 'df', 'sum of squares', 'mean square', 'F', 'p'] as const,
  notPrinted: (sizes: string) => `Also in this record, not printed: ${sizes}.`,
  everyField: () => 'Every field',
  chartNotDrawn: () => 'This chart was not drawn.',
  chartFailed: (why: string) => `This chart could not be drawn: ${why}`,
  dependsOnError: () => 'Depends on an error: ',
  error: () => 'Error: ',
};
