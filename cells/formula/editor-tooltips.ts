/**
 * The formula editor's two hints, both read from the registry's entries in the catalogue:
 * the doc of a built-in under the pointer, and the signature of the call being typed with
 * the argument under the caret in bold (shown after `(` and `,`, while the editor has focus).
 */
import { StateEffect, StateField, type EditorState, type Extension } from '@codemirror/state';
import { EditorView, hoverTooltip, showTooltip, type Tooltip } from '@codemirror/view';
import type { BuiltinInfo, NameCatalogue } from '../view-api.ts';
import { firstSentence } from './editor-complete.ts';
import { callAt, nameAt, parameterOf, signaturePieces } from './editor-hints.ts';

/** Where the editor finds the built-ins (the host element's catalogue, read when needed). */
export type BuiltinsOf = (state: EditorState) => NameCatalogue | null;

function find(catalogue: NameCatalogue | null, name: string): BuiltinInfo | undefined {
  if (catalogue === null) return undefined;
  // a cell may take a built-in's name; then the name means the cell
  if (catalogue.cells.some((c) => c.name === name)) return undefined;
  return catalogue.builtins.find((b) => b.name === name);
}

function el<K extends keyof HTMLElementTagNameMap>(tag: K, cls: string, text?: string): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  e.className = cls;
  if (text !== undefined) e.textContent = text;
  return e;
}

/** The doc of a built-in on hover: signature, what it does, what it returns, an example. */
export function builtinDoc(b: BuiltinInfo): HTMLElement {
  const box = el('div', 'furrow-info furrow-hover');
  box.append(el('code', 'furrow-info-signature', b.signature), el('p', '', firstSentence(b.doc, 320)));
  if (b.returns !== '') box.append(el('p', 'furrow-info-returns', `Returns ${b.returns}.`));
  if (b.example !== undefined && b.example !== '') {
    const ex = el('p', 'furrow-info-example');
    ex.append(el('span', 'furrow-info-label', 'e.g. '), el('code', '', b.example));
    box.append(ex);
  }
  return box;
}

/** The signature of a call with one parameter in bold, and that parameter's doc below. */
export function signatureHint(b: BuiltinInfo, current: number): HTMLElement {
  const box = el('div', 'furrow-info furrow-signature');
  const line = el('code', 'furrow-info-signature');
  const pieces = signaturePieces(b);
  line.append(pieces.head);
  pieces.params.forEach((p, i) => {
    if (i > 0) line.append(', ');
    line.append(i === current ? el('strong', 'furrow-current-param', p) : p);
  });
  line.append(pieces.tail);
  box.append(line);
  const param = b.params[current];
  if (param !== undefined) {
    const doc = el('p', 'furrow-param-doc');
    doc.append(el('b', '', `${param.name}: `), param.doc !== '' ? firstSentence(param.doc, 200) : param.description);
    box.append(doc);
  }
  return box;
}

/** Hover docs on built-in names. */
export function hoverDocs(catalogueOf: BuiltinsOf): Extension {
  return hoverTooltip(
    (view, pos) => {
      const spot = nameAt(view.state.doc.toString(), pos);
      if (spot === null) return null;
      const b = find(catalogueOf(view.state), spot.name);
      if (b === undefined) return null;
      return { pos: spot.from, end: spot.to, above: true, create: () => ({ dom: builtinDoc(b) }) };
    },
    { hoverTime: 350 },
  );
}

const setFocus = StateEffect.define<boolean>();

/** Whether the editor has focus, kept in the state so the signature hint can follow it. */
const focused = StateField.define<boolean>({
  create: () => false,
  update(value, tr) {
    for (const e of tr.effects) if (e.is(setFocus)) return e.value;
    return value;
  },
});

/** The signature hint: a tooltip above the caret while it is inside a built-in's call. */
export function signatureHints(catalogueOf: BuiltinsOf): Extension {
  const hint = StateField.define<Tooltip | null>({
    create: () => null,
    update(value, tr) {
      if (!tr.docChanged && !tr.selection && !tr.effects.some((e) => e.is(setFocus))) return value;
      const state = tr.state;
      if (!state.field(focused) || !state.selection.main.empty) return null;
      const head = state.selection.main.head;
      const call = callAt(state.doc.toString(), head);
      if (call === null) return null;
      const b = find(catalogueOf(state), call.fn.name);
      if (b === undefined) return null;
      const current = parameterOf(b, call);
      return { pos: head, above: true, strictSide: true, arrow: false, create: () => ({ dom: signatureHint(b, current) }) };
    },
    provide: (f) => showTooltip.from(f),
  });
  return [focused, EditorView.focusChangeEffect.of((_state, focusing) => setFocus.of(focusing)), hint];
}
