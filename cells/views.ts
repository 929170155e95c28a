/**
 * The view of each cell kind, one line each (the page's counterpart of cells/kinds.ts).
 * Importing this module defines the custom elements.
 */
import { html, type TemplateResult } from 'lit';
import type { Cell } from '../src/doc/document.ts';
import './formula/view.ts';
import './note/view.ts';
import './table/view.ts';
import type { CellViewState, NameCatalogue } from './view-api.ts';

type ViewTemplate = (cell: Cell, state: CellViewState | null, catalogue: NameCatalogue) => TemplateResult;

/** The template of each kind's view, by marker word. */
export const CELL_VIEWS: ReadonlyMap<string, ViewTemplate> = new Map<string, ViewTemplate>([
  ['note', (c, s, k) => html`<furrow-note-cell .cell=${c} .state=${s} .catalogue=${k}></furrow-note-cell>`],
  ['table', (c, s, k) => html`<furrow-table-cell .cell=${c} .state=${s} .catalogue=${k}></furrow-table-cell>`],
  ['formula', (c, s, k) => html`<furrow-formula-cell .cell=${c} .state=${s} .catalogue=${k}></furrow-formula-cell>`],
]);
