/**
 * A verification as lines of plain text: what `furrow verify` prints and what the report
 * and the page's banner list. The engine's version comes first when it differs.
 */
import type { Verification } from './verify.ts';

/** The verdict as lines of text. */
export function verificationText(path: string, v: Verification): string[] {
  const lines: string[] = [];
  if (!v.sealed) {
    lines.push(`${path}: ${v.problems[0] ?? 'not sealed.'}`);
    return lines;
  }
  if (!v.engine.same) {
    lines.push(`Engine: sealed by ${v.engine.sealedBy ?? 'an unnamed engine'}, recomputed by ${v.engine.now}; results may differ in their last digits for that reason alone.`);
  }
  for (const p of v.problems) lines.push(`Sealed section: ${p}`);
  if (v.fingerprint.same) lines.push(`Fingerprint: matches (sha256:${v.fingerprint.now}).`);
  else {
    lines.push(`Fingerprint: DIFFERS (now sha256:${v.fingerprint.now}).`);
    for (const d of v.fingerprint.details) lines.push(`  ${d}`);
  }
  lines.push('');
  lines.push('Values:');
  const width = Math.max(0, ...v.values.map((x) => x.name.length));
  for (const x of v.values) {
    const where = x.cell === null ? '' : `  (cell ${x.cell})`;
    lines.push(`  ${x.state.padEnd(8)} ${x.name.padEnd(width)}${where}`.trimEnd());
    if (x.state !== 'same') for (const d of x.details) lines.push(`           ${d}`);
  }
  lines.push('');
  const failing = v.claims.filter((c) => c.state !== 'holds' || c.heldWhenSealed !== true);
  const holding = v.claims.length - failing.length;
  lines.push(`Claims: ${holding} of ${v.claims.length} hold as sealed.`);
  for (const c of failing) {
    const who = c.name === null ? '' : ` (${c.name}${c.cell === null ? '' : `, cell ${c.cell}`})`;
    const what =
      c.state === 'holds'
        ? 'holds now, but did not when sealed'
        : c.state === 'fails'
        ? c.heldWhenSealed
          ? 'NO LONGER HOLDS'
          : 'does not hold (nor did it when sealed)'
        : c.state === 'error'
          ? `cannot be checked: ${c.detail ?? ''}`
          : c.state === 'gone'
            ? 'is gone: it is no longer in the document'
            : `is new: it ${c.detail ?? ''}`;
    lines.push(`  "${c.statement}"${who} ${what}`);
  }
  lines.push('');
  const changed = v.values.filter((x) => x.state !== 'same').length;
  lines.push(
    v.matches
      ? `Verified: every value is the same, bit for bit, and every claim holds.`
      : `NOT VERIFIED: ${[
          !v.engine.same ? 'another engine version' : '',
          v.problems.length > 0 ? `${v.problems.length} problems with the sealed section` : '',
          !v.fingerprint.same ? 'the fingerprint differs' : '',
          changed > 0 ? `${changed} ${changed === 1 ? 'value differs' : 'values differ'}` : '',
          failing.length > 0 ? `${failing.length} ${failing.length === 1 ? 'claim does' : 'claims do'} not hold as sealed` : '',
        ]
          .filter((s) => s !== '')
          .join('; ')}.`,
  );
  return lines;
}

