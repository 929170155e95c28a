/**
 * The bar above the table cell's grid: the table's name (renamed in place), its size, saving
 * it as a CSV file, the tools that change its shape, importing a CSV file in its place, and
 * the switch between the grid and the CSV text.
 */
import { html, nothing, type TemplateResult } from 'lit';
import { CsvError } from '../../src/doc/csv-error.ts';
import { tableCsv } from '../../src/doc/table-csv.ts';
import { decodeUtf8 } from '../../src/doc/utf8.ts';
import type { Table } from '../../src/lang/values.ts';
import { downloadCsv, fileNameFor } from '../../src/views/download.ts';
import { tableNameProblem } from './grid-checks.ts';
import type { GridHost } from './grid-host.ts';
import { SHAPE_KEYS, at } from './grid-keys.ts';
import { gridMsg } from '../../src/messages/grid.ts';
import { bodyOfText, readBodyGrid, type BodyGrid, type FieldSource } from './grid-model.ts';
import { tableMarker, writeTableMarker } from './model.ts';

/** The largest CSV file the import reads. */
const IMPORT_LIMIT_MB = 64;

/** What the toolbar needs besides the grid's host: the name's problem and the text switch. */
export interface ToolbarHost extends GridHost {
  nameProblem: string | null;
  textPinned: boolean;
  readonly gridError: CsvError | null;
}

export class GridToolbar {
  private readonly host: ToolbarHost;

  constructor(host: ToolbarHost) {
    this.host = host;
  }

  /** The table as it reads now, if it reads as one. */
  private savable(): Table | null {
    const v = this.host.state?.value;
    return v !== null && v !== undefined && typeof v === 'object' && v.kind === 'table' ? v : null;
  }

  private saveCsv(): void {
    const t = this.savable();
    if (t !== null) downloadCsv(fileNameFor(tableMarker(this.host.cell).name, 'csv'), tableCsv(t));
  }

  render(src: FieldSource | null, showText: boolean): TemplateResult {
    const host = this.host;
    const name = host.tableName ?? '';
    const ro = host.readOnly;
    const noGrid = src === null || showText;
    return html`<div class="top">
      <input
        class="table-name"
        aria-label=${gridMsg.tableNameLabel()}
        spellcheck="false"
        autocomplete="off"
        .value=${name}
        aria-invalid=${host.nameProblem !== null ? 'true' : 'false'}
        @keydown=${this.onNameKey}
        @input=${() => {
          if (host.nameProblem !== null) host.nameProblem = null;
        }}
        @blur=${this.onNameBlur}
      />
      ${src !== null && !showText ? html`<span class="counts num">${gridMsg.counts(src.rowCount, src.header.length)}</span>` : nothing}
      ${this.savable() === null
        ? nothing
        : html`<button class="save-csv" title=${gridMsg.saveCsvTitle()} @click=${() => this.saveCsv()}>${gridMsg.saveCsv()}</button>`}
      ${ro ? nothing : html`<span class="tools" role="toolbar" aria-label=${gridMsg.toolsLabel()}>
        <button ?disabled=${noGrid} title=${gridMsg.addRowTitle(SHAPE_KEYS.rowBelow, SHAPE_KEYS.rowAbove)} @click=${() => host.run({ kind: 'insert-row', below: true })}>${gridMsg.addRow()}</button>
        <button ?disabled=${noGrid} title=${gridMsg.addColumnTitle(SHAPE_KEYS.columnRight, SHAPE_KEYS.columnLeft)} @click=${() => host.run({ kind: 'insert-column', right: true })}>${gridMsg.addColumn()}</button>
        <button ?disabled=${noGrid} title=${gridMsg.deleteRowsTitle(SHAPE_KEYS.deleteRows)} @click=${() => host.run({ kind: 'delete-rows' })}>${gridMsg.deleteRows()}</button>
        <button ?disabled=${noGrid} title=${gridMsg.deleteColumnsTitle(SHAPE_KEYS.deleteColumns)} @click=${() => host.run({ kind: 'delete-columns' })}>${gridMsg.deleteColumns()}</button>
        <button title=${gridMsg.importCsvTitle()} @click=${this.chooseFile}>${gridMsg.importCsv()}</button>
        <button
          title=${showText ? gridMsg.showGridTitle() : gridMsg.showTextTitle()}
          ?disabled=${showText && host.gridError !== null}
          @click=${this.toggleText}
        >${showText ? gridMsg.showGrid() : gridMsg.showText()}</button>
      </span>
      <input class="file-input" type="file" accept=".csv,text/csv,text/plain" tabindex="-1" aria-hidden="true" @change=${this.onFileChosen} />`}
    </div>`;
  }

  // ---- the table's name ------------------------------------------------------------------

  private readonly onNameKey = (e: KeyboardEvent): void => {
    const input = e.currentTarget as HTMLInputElement;
    if (e.key === 'Enter') {
      e.preventDefault();
      if (this.rename(input.value)) this.host.focusGrid();
    } else if (e.key === 'Escape') {
      e.preventDefault();
      input.value = this.host.tableName ?? '';
      this.host.nameProblem = null;
    }
  };

  private readonly onNameBlur = (e: FocusEvent): void => {
    const input = e.currentTarget as HTMLInputElement;
    if (!this.rename(input.value)) input.value = this.host.tableName ?? '';
  };

  /** Renames the table; false (with the reason shown) when the name cannot be used. */
  private rename(raw: string): boolean {
    const host = this.host;
    const name = raw.trim();
    const current = host.tableName;
    if (name === current) {
      host.nameProblem = null;
      return true;
    }
    const taken = new Set<string>();
    for (const c of host.catalogue?.cells ?? []) if (c.name !== current) taken.add(c.name);
    const problem = tableNameProblem(name, current, taken);
    if (problem !== null) {
      host.nameProblem = problem;
      return false;
    }
    host.nameProblem = null;
    const m = tableMarker(host.cell);
    const marker = writeTableMarker(name, m.file, m.extra);
    host.send({ type: 'marker', id: host.cell.id, marker });
    return true;
  }

  // ---- grid or text ----------------------------------------------------------------------

  private readonly toggleText = (): void => {
    const host = this.host;
    host.textPinned = !(host.textPinned || host.gridError !== null);
    if (!host.textPinned) void host.updateComplete.then(() => host.focusGrid());
  };

  // ---- import ------------------------------------------------------------------------------

  private readonly chooseFile = (): void => {
    this.host.renderRoot.querySelector<HTMLInputElement>('input.file-input')?.click();
  };

  private readonly onFileChosen = async (e: Event): Promise<void> => {
    const input = e.currentTarget as HTMLInputElement;
    const f = input.files?.[0];
    input.value = '';
    if (!f) return;
    await this.importFile(f);
  };

  /** Replaces the body with a CSV file's text when it reads as a table; says why when not. */
  async importFile(f: Blob & { readonly name?: string }): Promise<void> {
    const host = this.host;
    const label = f.name ?? 'The file';
    if (host.readOnly) {
      host.say('problem', gridMsg.readOnly(host.file ?? ''));
      return;
    }
    if (f.size > IMPORT_LIMIT_MB * 1024 * 1024) {
      host.say('problem', gridMsg.importTooBig(label, IMPORT_LIMIT_MB));
      return;
    }
    let bytes: Uint8Array;
    try {
      bytes = new Uint8Array(await f.arrayBuffer());
    } catch {
      host.say('problem', gridMsg.importUnreadable(label));
      return;
    }
    let text: string;
    try {
      // refused, never repaired: a replaced byte would change a measurement without a word
      text = decodeUtf8(bytes);
    } catch {
      host.say('problem', gridMsg.importNotUtf8(label));
      return;
    }
    // a CSV file's byte-order mark is not part of its first column's name
    const body = bodyOfText(text.replace(/^\uFEFF/, ''));
    let g: BodyGrid;
    try {
      g = readBodyGrid(body);
    } catch (err) {
      if (!(err instanceof CsvError)) throw err;
      host.say('problem', gridMsg.importFailed(label, err.message));
      return;
    }
    host.textPinned = false;
    host.commit(g);
    host.sel = at(0, 0);
    host.say('info', gridMsg.imported(label, g.rows.length, g.header.length));
  }
}
