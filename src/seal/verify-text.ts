/**
 * A verification as lines of plain text: what `furrow verify` prints and what the report
 * and the page's banner list. The engine's version comes first when it differs.
 */
import { sealMsg, type ClaimStanding } from '../messages/seal.ts';
import type { Verification } from './verify.ts';

/** The verdict as lines of text. */
export function verificationText(path: string, v: Verification): string[] {
  const lines: string[] = [];
  if (!v.sealed) {
    lines.push(sealMsg.notSealed(path, v.problems[0] ?? null));
    return lines;
  }
  if (!v.engine.same) lines.push(sealMsg.otherEngine(v.engine.sealedBy, v.engine.now));
  for (const p of v.problems) lines.push(sealMsg.sectionProblem(p));
  if (v.fingerprint.same) lines.push(sealMsg.fingerprintMatches(v.fingerprint.now));
  else {
    lines.push(sealMsg.fingerprintDiffers(v.fingerprint.now));
    for (const d of v.fingerprint.details) lines.push(`  ${d}`);
  }
  lines.push('');
  lines.push(sealMsg.valuesHeading());
  const width = Math.max(0, ...v.values.map((x) => x.name.length));
  for (const x of v.values) {
    const where = x.cell === null ? '' : `  ${sealMsg.atCell(x.cell)}`;
    lines.push(`  ${x.state.padEnd(8)} ${x.name.padEnd(width)}${where}`.trimEnd());
    if (x.state !== 'same') for (const d of x.details) lines.push(`           ${d}`);
  }
  lines.push('');
  const failing = v.claims.filter((c) => c.state !== 'holds' || c.heldWhenSealed !== true);
  const holding = v.claims.length - failing.length;
  lines.push(sealMsg.claimsHeading(holding, v.claims.length));
  for (const c of failing) {
    const who = c.name === null ? '' : ` ${sealMsg.claimWho(c.name, c.cell)}`;
    const standing: ClaimStanding =
      c.state === 'holds' ? 'held-now-only' : c.state === 'fails' ? (c.heldWhenSealed ? 'no-longer' : 'never') : c.state === 'error' ? 'error' : c.state === 'gone' ? 'gone' : 'new';
    lines.push(`  "${c.statement}"${who} ${sealMsg.claimStanding(standing, c.detail ?? '')}`);
  }
  lines.push('');
  const changed = v.values.filter((x) => x.state !== 'same').length;
  lines.push(
    v.matches
      ? sealMsg.verified()
      : sealMsg.notVerified(
          [
            !v.engine.same ? sealMsg.reasonEngine() : '',
            v.problems.length > 0 ? sealMsg.reasonSection(v.problems.length) : '',
            !v.fingerprint.same ? sealMsg.reasonFingerprint() : '',
            changed > 0 ? sealMsg.reasonValues(changed) : '',
            failing.length > 0 ? sealMsg.reasonClaims(failing.length) : '',
          ].filter((s) => s !== ''),
        ),
  );
  return lines;
}
