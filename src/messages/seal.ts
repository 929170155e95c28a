/**
 * The words of sealing and verifying: the verdict that `furrow verify` prints and that the
 * report and the page's hand-off panel list (src/seal/verify-text.ts), the problems of a
 * sealed section (src/seal/section.ts) and what differs in a value (src/seal/verify.ts).
 */

/** How a claim stands on verifying, as its line says it. */
export type ClaimStanding = 'held-now-only' | 'no-longer' | 'never' | 'error' | 'gone' | 'new';

export const sealMsg = {
  // ---- the JSON of sealed values, read back ----------------------------------------------
  jsonAt: (what: string, character: number) => `${what} at character ${character}`,
  jsonNestedTooDeeply: () => 'nested too deeply',
  jsonExpectedName: () => 'expected a quoted name',
  jsonExpected: (ch: string) => `expected "${ch}"`,
  jsonExpectedEither: (a: string, b: string) => `expected "${a}" or "${b}"`,
  jsonControlCharacter: () => 'a control character inside a text',
  jsonBadUnicodeEscape: () => 'a bad \\u escape',
  jsonBadEscape: () => 'a bad escape',
  jsonUnclosedText: () => 'a text that is never closed',
  jsonTrailingText: () => 'unexpected text after the value',
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
  // ---- problems with the sealed section -----------------------------------------------
  noSection: () => 'The document has no sealed section: seal it first (furrow seal FILE).',
  manySections: (count: number, lines: readonly number[]) =>
    `The document has ${count} sealed sections (at lines ${lines.join(', ')}); a sealed document has one. The last one is checked.`,
  markerExtraWords: (line: number, marker: string) => `Line ${line}: the sealed section's marker has extra words: --- ${marker}`,
  claimsEdited: () => 'The "claims:" line is not written as a seal writes it for this document (it was edited by hand).',
  valueEdited: (line: number, name: string) =>
    `Line ${line}: the sealed value of ${name} is not written as a seal writes it (it reads as the same value, but was edited by hand).`,
  notNameValue: (line: number, text: string) => `Line ${line} of the sealed section is not "name: value": ${text}`,
  keyTwice: (line: number, key: string) => `Line ${line}: the sealed section says "${key}" twice.`,
  valueTwice: (line: number, name: string) => `Line ${line}: the value of ${name} is sealed twice.`,
  valueUnreadable: (line: number, name: string, detail: string) => `Line ${line}: the sealed value of ${name} cannot be read (${detail}).`,
  keyMissing: (key: string) => `The sealed section has no "${key}:" line.`,
  badDigest: (line: number, key: string) => `Line ${line}: "${key}:" should be sha256: followed by 64 hex digits.`,
  badData: (line: number) => `Line ${line}: "data:" should list each data file with its sha256 digest.`,
  badClaims: (line: number) => `Line ${line}: "claims:" should be a list of claims, each with cell, name, holds and statement.`,
  // ---- why the fingerprint differs -------------------------------------------------------
  cellsLineEdited: () => 'The "cells:" line does not match the document (it was edited).',
  cellsChanged: () => 'The cells changed since sealing.',
  dataNotNamed: (file: string) => `The data file ${file} was not named when the document was sealed.`,
  dataMissing: (file: string) => `The data file ${file} is missing.`,
  dataLineEdited: (file: string) => `The "data:" line does not match ${file} (it was edited).`,
  dataChanged: (file: string) => `The data file ${file} changed since sealing.`,
  dataNoLongerNamed: (file: string) => `The data file ${file} is no longer named by any table.`,
  noFingerprint: () => 'The seal has no readable fingerprint.',
  fingerprintEdited: () => 'The fingerprint line does not match the document (it was edited).',
  // ---- values and claims -----------------------------------------------------------------
  valueGone: (name: string) => `${name} was sealed, but no cell defines it now.`,
  valueNew: (name: string) => `${name} is defined now but was not sealed.`,
  moreDifferences: (more: number, atLeast: boolean) => `and ${atLeast ? 'more than ' : ''}${more} more ${more === 1 ? 'difference' : 'differences'}`,
  claimNotSealed: (holds: boolean) => `${holds ? 'holds' : 'does not hold'}, but was not sealed`,
  claimCellError: (detail: string) => `its cell holds an error: ${detail}`,
  claimGone: () => 'it is no longer in the document',
  // ---- what differs in a value (`path` names the part: "fit.means.mean[2]") ---------------
  lengthsDiffer: (path: string, was: number, now: number) => `${path}: ${was} elements when sealed, ${now} now`,
  digestDiffers: (path: string, n: number) => `${path}: the digest of its ${n} elements differs`,
  runsDiffer: (path: string, runs: readonly string[], moreRuns: number, n: number) =>
    `${path}: elements ${runs.join(', ')}${moreRuns > 0 ? ` and ${moreRuns} more runs` : ''} differ (of ${n}, sealed by digest)`,
  chartDiffers: (path: string) => `${path}: the chart's specification differs`,
  fieldsDiffer: (path: string, was: readonly string[], now: readonly string[]) =>
    `${path}: fields were ${was.join(', ') || 'none'}; now ${now.join(', ') || 'none'}`,
  valueWasNow: (path: string, was: string, now: string, ulps: number | null) =>
    `${path}: was ${was}, now ${now}${ulps === null ? '' : ` (${ulps} ${ulps === 1 ? 'unit' : 'units'} in the last place)`}`,
  sealedError: (message: string) => `an error (${message})`,
  sealedByDigest: (n: number) => `${n} elements, sealed by digest`,
  // ---- the verdict -----------------------------------------------------------------------
  verified: () => 'Verified: every value is the same, bit for bit, and every claim holds.',
  notVerified: (reasons: readonly string[]) => `NOT VERIFIED: ${reasons.join('; ')}.`,
  reasonEngine: () => 'another engine version',
  reasonSection: (problems: number) => `${problems} problems with the sealed section`,
  reasonFingerprint: () => 'the fingerprint differs',
  reasonValues: (changed: number) => `${changed} ${changed === 1 ? 'value differs' : 'values differ'}`,
  reasonClaims: (failing: number) => `${failing} ${failing === 1 ? 'claim does' : 'claims do'} not hold as sealed`,
} as const;
