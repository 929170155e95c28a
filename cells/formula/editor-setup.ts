/**
 * The CodeMirror configuration of formula editors. A page may hold hundreds of formula
 * cells, so every editor shares one extensions array (made once per set of built-ins) and
 * adds only a facet that says which cell element it belongs to. The editor keeps no undo
 * history of its own: the document's undo lives in the shell, and the undo keys ask for it.
 */
import { autocompletion, closeBrackets, closeBracketsKeymap, completionKeymap, type Completion, type CompletionContext, type CompletionResult } from '@codemirror/autocomplete';
import { defaultKeymap } from '@codemirror/commands';
import { bracketMatching } from '@codemirror/language';
import { linter } from '@codemirror/lint';
import { Annotation, Compartment, Facet, Prec, type EditorState, type Extension } from '@codemirror/state';
import { EditorView, keymap, placeholder } from '@codemirror/view';
import type { BuiltinInfo, NameCatalogue } from '../view-api.ts';
import { completionSpot, firstSentence, offersAt, type Offer } from './editor-complete.ts';
import { builtinNames, formulaHighlighting } from './editor-language.ts';
import { hoverDocs, signatureHints } from './editor-tooltips.ts';

/** What an editor asks of the element that holds it. */
export interface FormulaEditorHost {
  /** The names completion offers, read when completion runs (they change as cells change). */
  readonly catalogue: NameCatalogue;
  /** The user changed the text. */
  edited(text: string): void;
  /** The editor lost focus. */
  blurred(): void;
  /** The undo and redo keys were pressed. */
  undo(): void;
  redo(): void;
}

/** Which element an editor belongs to (one value per editor). */
export const editorHost = Facet.define<FormulaEditorHost, FormulaEditorHost | null>({
  combine: (values) => values[0] ?? null,
});

/** Marks a transaction that takes text from the document (undo, another view): it is not an edit to send back. */
export const fromDocument = Annotation.define<boolean>();

function hostOf(view: EditorView): FormulaEditorHost | null {
  return view.state.facet(editorHost);
}

/** The info panel of a built-in: signature, one line of what it does, what it returns. */
function builtinInfo(b: BuiltinInfo): Node {
  const box = document.createElement('div');
  box.className = 'furrow-info';
  const sig = document.createElement('code');
  sig.className = 'furrow-info-signature';
  sig.textContent = b.signature;
  const doc = document.createElement('p');
  doc.textContent = firstSentence(b.doc);
  box.append(sig, doc);
  if (b.returns !== '') {
    const ret = document.createElement('p');
    ret.className = 'furrow-info-returns';
    ret.textContent = `Returns ${b.returns}.`;
    box.append(ret);
  }
  return box;
}

function helpInfo(text: string): Node {
  const p = document.createElement('p');
  p.className = 'furrow-info';
  p.textContent = firstSentence(text);
  return p;
}

function toCompletion(o: Offer): Completion {
  const c: Completion = { label: o.label, type: o.type, detail: o.detail };
  if (o.boost !== undefined) c.boost = o.boost;
  const builtin = o.builtin;
  if (builtin !== undefined) c.info = () => builtinInfo(builtin);
  else if (o.help !== undefined && o.help !== '') {
    const help = o.help;
    c.info = () => helpInfo(help);
  }
  const apply = o.apply;
  const replaceFrom = o.replaceFrom;
  if (apply !== undefined && replaceFrom !== undefined) {
    // a header that is not a plain name: `t.` becomes `t["yield (kg)"]`
    c.apply = (view, _completion, _from, to) => {
      view.dispatch({
        changes: { from: replaceFrom, to, insert: apply },
        selection: { anchor: replaceFrom + apply.length },
        userEvent: 'input.complete',
      });
    };
  } else if (apply !== undefined) c.apply = apply;
  return c;
}

/** The completion source: names, members after `name.`, named arguments in a call. */
export function formulaCompletions(context: CompletionContext): CompletionResult | null {
  const host = context.state.facet(editorHost);
  if (host === null) return null;
  const spot = completionSpot(context.state.doc.toString(), context.pos);
  const found = offersAt(spot, host.catalogue, context.explicit);
  if (found === null || found.offers.length === 0) return null;
  return { from: found.from, options: found.offers.map(toCompletion), validFor: /^[A-Za-z0-9_]*:?$/ };
}

const undoKeys = Prec.highest(
  keymap.of([
    { key: 'Mod-z', preventDefault: true, run: (v) => (hostOf(v)?.undo(), true) },
    { key: 'Mod-Shift-z', preventDefault: true, run: (v) => (hostOf(v)?.redo(), true) },
    { key: 'Mod-y', preventDefault: true, run: (v) => (hostOf(v)?.redo(), true) },
  ]),
);

const listener = EditorView.updateListener.of((u) => {
  const host = u.state.facet(editorHost);
  if (host === null) return;
  if (u.docChanged && !u.transactions.some((t) => t.annotation(fromDocument) === true)) host.edited(u.state.doc.toString());
  if (u.focusChanged && !u.view.hasFocus) host.blurred();
});

const look = EditorView.theme({
  '&': {
    fontSize: '0.92rem',
    color: 'var(--ink)',
    backgroundColor: 'var(--sheet)',
    borderRadius: 'var(--radius)',
  },
  '&.cm-focused': { outline: '1px solid var(--accent)' },
  '.cm-scroller': { fontFamily: 'var(--font-code)', lineHeight: '1.5' },
  '.cm-content': { padding: '6px 0', caretColor: 'var(--ink)' },
  '.cm-line': { padding: '0 8px' },
  '.cm-cursor': { borderLeftColor: 'var(--ink)' },
  '&.cm-focused .cm-selectionBackground, .cm-selectionBackground': { backgroundColor: 'var(--accent-soft)' },
  '.cm-matchingBracket': { backgroundColor: 'var(--accent-soft)', outline: 'none' },
  '.cm-nonmatchingBracket': { color: 'var(--error)' },
  // our own underline: a wavy line in the theme's error colour, under the exact characters
  '.cm-lintRange': { backgroundImage: 'none', paddingBottom: '0' },
  '.cm-lintRange-error': {
    textDecoration: 'underline wavy var(--error)',
    textDecorationSkipInk: 'none',
    textUnderlineOffset: '3px',
  },
  '.cm-lintRange-warning': {
    textDecoration: 'underline wavy var(--upstream)',
    textDecorationSkipInk: 'none',
    textUnderlineOffset: '3px',
  },
  '.cm-lintPoint:after': { borderBottomColor: 'var(--error)' },
  '.cm-tooltip': {
    fontFamily: 'var(--font-ui)',
    fontSize: '0.82rem',
    border: '1px solid var(--rule-strong)',
    backgroundColor: 'var(--sheet)',
    color: 'var(--ink)',
  },
  '.cm-tooltip.cm-tooltip-autocomplete > ul': { fontFamily: 'var(--font-code)', maxHeight: '14em' },
  '.cm-tooltip.cm-tooltip-autocomplete > ul > li[aria-selected]': { backgroundColor: 'var(--accent)', color: 'var(--sheet)' },
  '.cm-completionDetail': { fontStyle: 'normal', color: 'var(--muted)', marginLeft: '0.8em' },
  '.cm-tooltip-autocomplete li[aria-selected] .cm-completionDetail': { color: 'var(--sheet)' },
  '.cm-completionInfo': { maxWidth: '26rem', padding: '0.4rem 0.6rem' },
  '.furrow-info p': { margin: '0.3rem 0 0' },
  '.furrow-hover, .furrow-signature': { padding: '0.35rem 0.6rem', maxWidth: '30rem' },
  '.furrow-current-param': { color: 'var(--ink)', textDecoration: 'underline', textUnderlineOffset: '2px' },
  '.furrow-info-example code': { fontFamily: 'var(--font-code)' },
  '.furrow-info-label, .furrow-param-doc': { color: 'var(--ink-soft)' },
  '.furrow-info-signature': { fontFamily: 'var(--font-code)', color: 'var(--accent)' },
  '.furrow-info-returns': { color: 'var(--ink-soft)' },
  '.cm-diagnostic': { fontFamily: 'var(--font-ui)' },
  '.cm-diagnostic-error': { borderLeftColor: 'var(--error)' },
  '.cm-diagnostic-warning': { borderLeftColor: 'var(--upstream)' },
});

const shared = new WeakMap<readonly BuiltinInfo[], Extension>();

const catalogueOf = (state: EditorState): NameCatalogue | null => state.facet(editorHost)?.catalogue ?? null;

/**
 * The slot that holds an editor's shared extensions. Editors made before the worker has
 * sent the built-ins (those on screen at load) start with an empty list; when the list
 * arrives the element swaps the extensions in this slot, so they highlight built-in names
 * exactly as editors made later do.
 */
export const formulaSetup = new Compartment();

/**
 * The extensions every formula editor of a page shares, made once per list of built-ins
 * (the catalogue's list is one array for the whole page, so in practice once).
 */
export function formulaExtensions(builtins: readonly BuiltinInfo[]): Extension {
  const known = shared.get(builtins);
  if (known !== undefined) return known;
  const ext: Extension = [
    formulaHighlighting(builtinNames(builtins)),
    placeholder('a formula, e.g. total = sum(plots.yield)'),
    undoKeys,
    keymap.of([...closeBracketsKeymap, ...completionKeymap, ...defaultKeymap]),
    closeBrackets(),
    bracketMatching(),
    autocompletion({ override: [formulaCompletions], icons: false, activateOnTyping: true }),
    hoverDocs(catalogueOf),
    signatureHints(catalogueOf),
    // diagnostics are set by the element (setDiagnostics); no lint source runs on its own
    linter(null),
    EditorView.lineWrapping,
    EditorView.contentAttributes.of({ 'aria-label': 'formula', spellcheck: 'false', autocorrect: 'off', autocapitalize: 'off' }),
    listener,
    look,
  ];
  shared.set(builtins, ext);
  return ext;
}
