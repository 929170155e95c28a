/**
 * The page's entry: opens the document this tab (or this browser) held last, or a sample,
 * and starts the app. `?sample=NAME` opens a sample (offering the edited copy when there is
 * one) and `?fresh` opens the first sample as a new document, leaving every kept one alone.
 */
import { pageMsg } from '../messages/page.ts';
import { DocumentKeeper } from './keeper.ts';
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
  const opening = await DocumentKeeper.initial(params, samples, DEFAULT_SAMPLE);
  try {
    app.start(opening, { samples });
  } catch {
    // a kept state that no longer reads stays in its slot; the first sample opens instead
    app.start(await DocumentKeeper.sample(DEFAULT_SAMPLE, samples.get(DEFAULT_SAMPLE)!), { samples, notice: pageMsg.keptUnreadable() });
  }
}

void boot();
