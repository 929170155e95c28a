/**
 * Files dropped on the page: a `.csv` goes to the shell (attached for the tables that name
 * it, else offered as a new table), a workbook (`.xlsx`) is offered as a table, a Parquet
 * file is attached for the tables that name it, anything
 * else is opened as a document (and refused, changing nothing, when it is not one). A cell
 * view that takes a drop itself prevents the default, and the page leaves it alone.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { pageMsg } from '../messages/page.ts';
import { checkFileSize, readFileText } from './files.ts';

export interface DropEvents {
  csv(name: string, bytes: Uint8Array): void;
  workbook(name: string, bytes: Uint8Array): void;
  /** A Parquet file: attached for the tables that name it. */
  data(name: string, bytes: Uint8Array): void;
  document(name: string, text: string): void;
  problem(text: string): void;
}

export class FileDrop implements ReactiveController {
  private readonly events: DropEvents;

  constructor(host: ReactiveControllerHost, events: DropEvents) {
    this.events = events;
    host.addController(this);
  }

  hostConnected(): void {
    window.addEventListener('dragover', this.onDragOver);
    window.addEventListener('drop', this.onDrop);
  }

  hostDisconnected(): void {
    window.removeEventListener('dragover', this.onDragOver);
    window.removeEventListener('drop', this.onDrop);
  }

  private readonly onDragOver = (e: DragEvent): void => {
    if (e.dataTransfer?.types.includes('Files')) e.preventDefault();
  };

  private readonly onDrop = (e: DragEvent): void => {
    const file = e.dataTransfer?.files[0];
    if (file === undefined || e.defaultPrevented) return;
    e.preventDefault();
    try {
      checkFileSize(file);
    } catch (err) {
      this.events.problem((err as Error).message);
      return;
    }
    if (/\.(csv|xlsx|parquet)$/i.test(file.name)) {
      const to = /\.csv$/i.test(file.name) ? this.events.csv : /\.xlsx$/i.test(file.name) ? this.events.workbook : this.events.data;
      void file.arrayBuffer().then(
        (b) => to.call(this.events, file.name, new Uint8Array(b)),
        (e: unknown) => this.events.problem(String(e)),
      );
      return;
    }
    void readFileText(file).then(
      (text) => this.events.document(file.name, text),
      () => this.events.problem(pageMsg.notUtf8(file.name)),
    );
  };
}
