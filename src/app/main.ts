/**
 * The page's entry: restores the last state from this browser (or opens a sample), and
 * starts the app. `?sample=NAME` opens a sample and `?fresh` ignores the saved state.
 */
import { loadSaved } from './autosave.ts';
import type { FurrowApp } from './app.ts';
import './app.ts';
import { THEME_PROPERTIES } from '../views/theme.ts';

const sheet = new CSSStyleSheet();
sheet.replaceSync(`:root {${THEME_PROPERTIES}}`);
document.adoptedStyleSheets = [...document.adoptedStyleSheets, sheet];

const SAMPLES: Record<string, string> = import.meta.glob('../../samples/*.furrow', { query: '?raw', import: 'default', eager: true });
const samples = new Map(Object.entries(SAMPLES).map(([path, text]) => [path.replace(/^.*\//, ''), text]));
const DEFAULT_SAMPLE = 'adhesive-cure.furrow';

async function boot(): Promise<void> {
  const app = document.querySelector<FurrowApp>('furrow-app');
  if (app === null) return;
  const params = new URLSearchParams(location.search);
  const asked = params.get('sample');
  const sampleName = asked !== null && samples.has(asked) ? asked : DEFAULT_SAMPLE;
  const saved = params.has('fresh') || asked !== null ? null : await loadSaved();
  if (saved !== null) {
    try {
      app.start(saved.text, { fileName: saved.fileName, files: saved.files, samples });
      return;
    } catch {
      // a saved state that no longer reads: keep it in storage, open the sample, and say so
      app.start(samples.get(sampleName)!, {
        fileName: sampleName,
        samples,
        notice: 'The document kept in this browser could not be read; a sample is open instead.',
      });
      return;
    }
  }
  app.start(samples.get(sampleName) ?? 'furrow 1\ntitle: Untitled trial\n', { fileName: sampleName, samples });
}

void boot();
