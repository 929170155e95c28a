/**
 * The registry's built-ins as the page shows them (completion, hover docs, signature hints,
 * the help panel): the worker sends this list once, when it is ready.
 */
import type { BuiltinInfo } from '../../cells/view-api.ts';
import { describeParam, signature, type Registry } from '../lang/builtins.ts';

/** Every built-in of a registry, with its signature, doc, category, example and parameters. */
export function builtinInfos(registry: Registry): BuiltinInfo[] {
  return registry.all().map((b) => ({
    name: b.name,
    signature: signature(b),
    doc: b.doc,
    returns: b.returns,
    category: b.category,
    example: b.example,
    params: b.params.map((p) => ({ name: p.name, description: describeParam(p), doc: p.doc })),
  }));
}
