/**
 * Copy, cut and paste in the table cell's grid. A copy gives the selected fields as
 * tab-separated text; a paste reads tab-separated or CSV text (cells/table/grid-paste.ts)
 * and writes it at the selection, growing the table as needed. Into a new table, a block
 * whose first row names its columns gets those names (cells/table/grid-names-row.ts), with
 * an offer, one click away, to keep that row as data instead.
 */
import { html, nothing, type TemplateResult } from 'lit';
import type { GridHost } from './grid-host.ts';
import { HEADER_ROW, selectionRect } from './grid-keys.ts';
import { gridMsg } from '../../src/messages/grid.ts';
import { fieldsIn, isRefusal, pasteBlock, type Pasted } from './grid-model.ts';
import { pasteWithNames } from './grid-names-row.ts';
import { blockToTsv, readBlock, type BlockFormat } from './grid-paste.ts';

/** A paste whose first row became the names, and what the plain paste would have been. */
interface NamesOffer {
  /** The body the paste with names gave: the offer stands while the table is still this. */
  readonly applied: string;
  readonly plain: Pasted;
  readonly rows: number;
  readonly width: number;
  readonly format: BlockFormat;
}

function pastedMessage(rows: number, width: number, done: Pasted, format: BlockFormat): string {
  const how = format === 'csv' ? ` ${gridMsg.pastedAsCsv()}` : '';
  return gridMsg.pasted(rows, width, done.addedRows, done.addedColumns) + how;
}

export class GridClipboard {
  private readonly host: GridHost;
  private offer: NamesOffer | null = null;

  constructor(host: GridHost) {
    this.host = host;
  }

  readonly onCopy = (e: ClipboardEvent): void => {
    const host = this.host;
    if (host.editor !== null) return;
    const src = host.shown?.source;
    if (!src || !e.clipboardData) return;
    const rect = selectionRect(host.sel);
    const block = fieldsIn(src, rect);
    e.clipboardData.setData('text/plain', blockToTsv(block));
    e.preventDefault();
    host.say('info', gridMsg.copied(block.length, rect.c1 - rect.c0 + 1));
  };

  readonly onCut = (e: ClipboardEvent): void => {
    if (this.host.editor !== null) return;
    this.onCopy(e);
    if (this.host.grid === null) return;
    this.host.run({ kind: 'clear' });
  };

  readonly onPaste = (e: ClipboardEvent): void => {
    if (this.host.editor !== null) return;
    e.preventDefault();
    this.paste(e.clipboardData?.getData('text/plain') ?? '');
  };

  /** Pastes text at the selection. */
  paste(text: string): void {
    const host = this.host;
    const g = host.grid;
    this.offer = null;
    if (g === null) {
      if (host.readOnly) host.say('problem', gridMsg.readOnly(host.file ?? ''));
      return;
    }
    const block = readBlock(text);
    if (!block.ok) {
      host.say('problem', block.message);
      return;
    }
    const target = selectionRect(host.sel);
    const done = pasteBlock(g, target, block.rows);
    if (isRefusal(done)) {
      host.say('problem', done.refused);
      return;
    }
    const named = pasteWithNames(g, target, block.rows);
    if (named !== null) {
      host.commit(named);
      host.sel = { anchor: { r: HEADER_ROW, c: 0 }, focus: { r: named.rows.length - 1, c: named.header.length - 1 } };
      this.offer = { applied: named.text, plain: done, rows: block.rows.length, width: block.width, format: block.format };
      host.say('info', gridMsg.pastedWithNames(block.rows.length, block.width));
      return;
    }
    host.commit(done.grid);
    host.sel = { anchor: { r: done.rect.r0, c: done.rect.c0 }, focus: { r: done.rect.r1, c: done.rect.c1 } };
    host.say('info', pastedMessage(block.rows.length, block.width, done, block.format));
  }

  /** Puts the first pasted row back as data: the table the plain paste would have given. */
  readonly keepFirstRowAsData = (): void => {
    const host = this.host;
    const o = this.offer;
    this.offer = null;
    if (o === null || host.grid?.text !== o.applied) {
      host.requestUpdate();
      return;
    }
    host.commit(o.plain.grid);
    const r = o.plain.rect;
    host.sel = { anchor: { r: r.r0, c: r.c0 }, focus: { r: r.r1, c: r.c1 } };
    host.say('info', pastedMessage(o.rows, o.width, o.plain, o.format));
    host.focusGrid();
  };

  /** The offer to keep the first row as data, while the table is as that paste left it. */
  renderOffer(): TemplateResult | typeof nothing {
    const o = this.offer;
    if (o === null || this.host.grid?.text !== o.applied) return nothing;
    return html`<p class="line offer"><button class="names-as-data" title=${gridMsg.namesRowAsDataTitle()} @click=${this.keepFirstRowAsData}>${gridMsg.namesRowAsData()}</button></p>`;
  }
}
