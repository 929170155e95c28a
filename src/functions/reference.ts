/**
 * The function reference of the README, generated from the registry so that the docs and
 * the language cannot drift apart (a test compares the README with this text).
 */
import { BUILTINS } from './index.ts';
import { CATEGORIES, describeParam, signature } from '../lang/builtins.ts';

/** The Markdown of the function reference. */
export function referenceMarkdown(): string {
  const out: string[] = [];
  for (const cat of CATEGORIES) {
    const fns = BUILTINS.all().filter((b) => b.category === cat);
    if (fns.length === 0) continue;
    out.push(`### ${cat.charAt(0).toUpperCase()}${cat.slice(1)}`, '');
    for (const b of fns) {
      out.push(`#### \`${signature(b)}\``, '');
      out.push(b.doc, '');
      if (b.params.length > 0) {
        for (const p of b.params) out.push(`- \`${p.name}\`: ${describeParam(p)}. ${p.doc}`);
        out.push('');
      }
      out.push(`Returns ${b.returns}. Example: \`${b.example}\``, '');
    }
  }
  return out.join('\n').trimEnd();
}
