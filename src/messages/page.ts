/**
 * The words of the page's shell: the toolbar's status line, the banner, the margin of each
 * cell, opening, saving and keeping documents. Views and tests build them here, so wording
 * changes in one place.
 */
import { JUDGEMENT, plural } from './words.ts';

/** How a cell stands, as its margin says it (empty: nothing to say). */
export const STATUS_WORDS: ReadonlyMap<string, string> = new Map([
  ['ok', ''],
  ['pending', 're-evaluating'],
  ['error', 'error'],
  ['upstream', 'depends on an error'],
  ['inert', 'kept, not evaluated'],
]);

export const pageMsg = {
  // ---- status line --------------------------------------------------------------------
  evaluatingStep: (name: string | null, done: number, total: number) => `evaluating ${name ?? 'a cell'}: ${done} of ${total} cells checked…`,
  reEvaluating: (n: number) => `re-evaluating ${plural(n, 'cell')}…`,
  cellsWithErrors: (errors: number, upstream: number) =>
    `${errors} ${errors === 1 ? 'cell has' : 'cells have'} an error${upstream > 0 ? `, ${upstream} ${upstream === 1 ? 'depends' : 'depend'} on ${errors === 1 ? 'it' : 'them'}` : ''}`,
  allUpToDate: () => 'every cell up to date',
  kept: () => 'kept in this browser',
  notKept: (why: string) => `not kept in this browser (${why})`,

  // ---- editing ------------------------------------------------------------------------
  editRefused: (why: string) => `That change could not be made: ${why}`,
  nothingToUndo: () => 'Nothing to undo.',
  nothingToRedo: () => 'Nothing to redo.',
  cellDeleted: () => 'Cell deleted. Undo (Ctrl+Z) brings it back.',
  notAName: (name: string) => `"${name}" cannot be a name: it starts with a letter or _, then letters, digits or _.`,
  renameInCell: () => 'Rename it in the cell itself',
  rename: () => 'Rename',
  unnamed: () => '(unnamed)',
  addBelow: (label: string) => `Add a ${label} below`,

  // ---- files --------------------------------------------------------------------------
  opened: (name: string | null) => `Opened ${name ?? 'the document'}.`,
  openedMissingFiles: (name: string | null, missing: readonly string[]) =>
    `Opened ${name ?? 'the document'}. Its tables read ${missing.join(', ')}: attach ${missing.length === 1 ? 'that file' : 'those files'} with "Attach data".`,
  /** Data files kept in this browser with the same text, taken back when a document is opened again. */
  restoredFiles: (name: string, files: readonly string[], missing: readonly string[]) =>
    `Opened ${name} with ${files.join(', ')} as ${files.length === 1 ? 'it was' : 'they were'} kept in this browser with the same text. If ${files.length === 1 ? 'it belongs' : 'they belong'} to another copy of this document, leave ${files.length === 1 ? 'it' : 'them'} out and attach the right ${files.length === 1 ? 'file' : 'files'}.${missing.length > 0 ? ` Its tables also read ${missing.join(', ')}: attach ${missing.length === 1 ? 'that file' : 'those files'} with "Attach data".` : ''}`,
  leaveOutFiles: () => 'Leave them out',
  notOpened: (name: string | null, why: string) => `${name ?? 'That file'} was not opened: ${why} Nothing on the page was changed.`,
  notUtf8: (name: string) => `${name} was not opened: it is not UTF-8 text, so it is not a Furrow document. Nothing on the page was changed.`,
  unreadable: (notText: boolean, detail: string) =>
    `The file could not be read${notText ? ': it is not UTF-8 text, so it is not a Furrow document' : `: ${detail}`}. Nothing on the page was changed.`,
  attached: (name: string) => `Attached ${name}.`,
  csvUnreadable: (detail: string) => `The CSV file could not be read: ${detail}.`,
  fileTooLarge: (name: string, limit: number) =>
    `${name} was not read: it is larger than the ${Math.round(limit / (1024 * 1024))} MB that the page reads. Nothing on the page was changed; the command line reads larger data files (furrow run).`,
  savedAs: (name: string) => `Saved as ${name}.`,
  saveFailed: (detail: string) => `Saving failed: ${detail}. The document is still kept in this browser.`,
  workerStopped: (detail: string) => `The evaluation worker stopped: ${detail || 'unknown error'}. Reload the page; your document is saved.`,
  evaluationFailed: (detail: string) => `Evaluation failed: ${detail}`,

  // ---- keeping documents --------------------------------------------------------------
  keptUnreadable: () => 'The document kept in this browser could not be read; a sample is open instead.',
  editedSampleOpen: (name: string) => `You edited the sample ${name} before: your edited copy is open.`,
  openOriginal: () => 'Open the original',
  originalOpen: (name: string, title: string) =>
    `The original ${name} is open. Your edited copy is kept as "${title}" under "Kept in this browser".`,
  keptList: () => 'Kept in this browser…',
  keptEntry: (title: string, where: string) => `${title} (${where})`,
  keptWhere: (key: string) =>
    key.startsWith('file:') ? key.slice(5) : key.startsWith('sample:') ? `sample ${key.slice(7).replace(/\.furrow$/, '')}` : 'new document',
  sharedWithTab: () => 'This document is open in another tab too. Edits in either tab are kept, and the last one saved wins: close one of the tabs to be safe.',
  savedInOtherTab: () => 'Another tab saved this document. Reload to see its version, or keep editing here and your version is saved over it.',
  reload: () => 'Reload',
  // a new document starts with no title and one empty note: what shows there is a placeholder
  newDocumentText: () => 'furrow 1\n\n--- note\n\n',
};

/** Words of the first hour: placeholders, empty cells, the help panel, the cell keys. */
export const startMsg = {
  titlePlaceholder: () => 'Untitled trial',
  notePrompt: () => 'What is compared, on what, and why.',
  emptyNote: () => 'Empty note: double-click or press Enter to write.',
  morePlaceholders: (n: number) => `and ${plural(n, 'other placeholder')}`,
  undo: () => 'Undo',
  formulaEmpty: () => 'empty: write an expression after "=" (cells that read this name see a missing value)',
  /** The one-click fix of `value1 = my_name = …` (a name typed after the offered one). */
  secondNameFix: (name: string) => `Name the cell ${name}`,
  secondNameFixTip: (name: string, offered: string) => `Keep the name you typed, ${name}, and drop the offered name ${offered}`,

  // ---- the help panel -----------------------------------------------------------------
  helpButton: () => 'Help',
  helpButtonTitle: () => 'Built-in functions and keys (F1)',
  helpHeading: () => 'Built-in functions',
  helpClose: () => 'Close help',
  helpSearch: () => 'Find a function',
  helpSearchPlaceholder: () => 'name or word, e.g. blocked, interval',
  helpAll: () => 'all',
  helpNothingFound: (q: string) => `No built-in matches "${q}".`,
  helpCount: (shown: number, total: number) => (shown === total ? `${total} functions` : `${shown} of ${total} functions`),
  helpReturns: (what: string) => `Returns ${what}.`,
  helpExample: () => 'Example',
  helpInsert: () => 'Add as a cell',
  helpInsertTitle: () => 'Add this example as a new formula cell at the end of the document',
  helpInsertAdapted: (from: string, to: string) => `Add as a cell (reading ${to} for ${from})`,
  helpNeeds: (what: string) => `Reads ${what}.`,
  helpMissing: (what: string) => `This document has no ${what}: the cell will say so until you add it or change the names.`,
  helpReady: () => 'This document has the names it reads.',
  helpInserted: (name: string | null) => `Added the example as a new cell${name === null ? '' : ` (${name})`} at the end of the document.`,
  helpKeysHeading: () => 'Keys for cells',
  helpKeysNote: () => 'Work anywhere on the page, in editors too.',
};

/** The labels, tooltips and names for assistive technology of the page's shell. */
export const shellWords = {
  loading: 'Loading…',
  samples: 'Samples…',
  caution: 'Caution',
  /** Under the last cell of every document: the general caution, as the report's footer says it. */
  judgement: JUDGEMENT,
  newDocument: 'New',
  open: 'Open…',
  save: 'Save',
  attachData: 'Attach data…',
  toolbarLabel: 'Document',
  newTip: 'Start an empty document',
  openTip: 'Open a .furrow document, or a CSV file or workbook to add as a table',
  saveTip: 'Save as a .furrow file (Ctrl+S)',
  attachTip: 'Attach a CSV or Parquet file that a table of this document reads',
  samplesLabel: 'Open a sample',
  keptListLabel: 'Open a document kept in this browser',
  undoTip: 'Undo (Ctrl+Z)',
  redoTip: 'Redo (Ctrl+Shift+Z)',
  dismiss: 'Dismiss',
  titleLabel: 'Title',
  addACellBelow: 'Add a cell below',
  undo: 'Undo',
  redo: 'Redo',
  newName: 'New name',
  cellTools: 'Cell tools',
  moveUp: 'Move up',
  moveDown: 'Move down',
  deleteTip: 'Delete this cell (undo brings it back)',
  delete: 'Delete',
  whereThisValueComesFrom: 'Where this value comes from',
  claims: 'Claims',
  goToItsCell: 'Go to its cell',
  reportTip: 'One HTML file with every value, chart and claim, that opens back as this document; print it or save it as PDF from the browser',
  close: 'Close',
  goToTheCell: 'Go to the cell',
  categories: 'Categories',
} as const;

/** The buttons and labels of values, charts and notes on the sheet. */
export const sheetWords = {
  saveCsv: () => 'Save CSV',
  saveCsvTitle: () => 'Save this table as a CSV file',
  saveAnalysisTable: () => 'Save the analysis table (CSV)',
  saveMeans: () => 'Save the means (CSV)',
  savePairs: () => 'Save the pairs (CSV)',
  saveRunSheet: () => 'Save run sheet (CSV)',
  saveSvg: () => 'Save SVG',
  saveSvgTitle: () => 'Save the chart as an SVG file (drawn as vectors: sharp at any size)',
  savePng: () => 'Save PNG',
  savePngTitle: () => "Save the chart as a PNG picture (twice the screen's resolution)",
  noteEditorLabel: () => 'Note text (Markdown; {expression} shows a live value)',
  noteLabel: () => 'Note; double-click or press Enter to edit',
};

/** Why an edit cannot apply to the document (shown in the banner; an edit the page built wrong). */
export const editMsg = {
  noCell: (id: string) => `no cell with id ${id}`,
  lineBreakInMarker: () => 'a cell line cannot hold a line break',
  idTaken: (id: string) => `cell id ${id} is taken`,
  spliceOutside: (from: number, to: number, length: number) => `characters ${from} to ${to} are outside a cell body of ${length} characters`,
};

/** The hand-off panel at the top of the sheet: the verdict of a seal, the claims strip, the report, where a value comes from. */
export const handOffWords = {
  verified: () => 'Verified: every value recomputes to its sealed value, bit for bit, and every claim holds.',
  notVerified: () => 'Not verified: this document no longer computes what was sealed. The differences are marked on their cells.',
  noClaimsLead: () => 'No claims yet: ',
  claimExample: () => 'claim(condition, "statement")',
  noClaimsTail: () => ' states a conclusion that is checked on every evaluation.',
  allClaimsHold: (n: number) => `All ${n} ${n === 1 ? 'claim holds' : 'claims hold'}:`,
  claimsFail: (failing: number, n: number) => `${failing} of ${n} ${n === 1 ? 'claim does' : 'claims do'} not hold:`,
  holds: () => 'holds',
  doesNotHold: () => 'does not hold',
  report: () => 'Report (HTML)',
  makingReport: () => 'Making the report…',
  reportFailed: (why: string) => `The report could not be made: ${why}`,
  notInSeal: () => 'Not in the seal: this value was defined after sealing.',
  differsFromSeal: (details: readonly string[]) => `Differs from its sealed value:\n${details.join('\n')}`,
  noteInDoubt: (claims: readonly string[]) => `A claim that reads numbers in this note does not hold: ${claims.join('; ')}`,
  whereFrom: (what: string) => `Where ${what} comes from`,
  cellAt: (position: number) => `cell ${position}`,
  stepOfKind: (kind: string, position: number) => `${kind} (cell ${position})`,
  reads: (names: readonly string[]) => `reads ${names.join(', ')}`,
  fromData: () => 'data',
  stepError: (detail: string) => `error: ${detail}`,
};
