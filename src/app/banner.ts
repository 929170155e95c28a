/**
 * The banner under the toolbar: one message at a time, with buttons for what may follow
 * (undo a deletion, open a sample's original, leave restored files out). A problem is read
 * out at once (role alert); news waits its turn (role status).
 */
import { html, nothing, type TemplateResult } from 'lit';
import { shellWords } from '../messages/page.ts';

/** A message shown in the banner under the toolbar, with buttons for what may follow. */
export interface Banner {
  readonly kind: 'info' | 'problem';
  readonly text: string;
  readonly actions?: readonly { readonly label: string; readonly run: () => void }[];
}

/** The banner, or nothing when there is none; `dismiss` takes it away. */
export function bannerView(banner: Banner | null, dismiss: () => void): TemplateResult | typeof nothing {
  if (banner === null) return nothing;
  return html`<div class="banner ${banner.kind}" role=${banner.kind === 'problem' ? 'alert' : 'status'}>
    <span>${banner.text}</span>
    ${(banner.actions ?? []).map((a) => html`<button class="action" @click=${a.run}>${a.label}</button>`)}
    <button @click=${dismiss} aria-label=${shellWords.dismiss}>✕</button>
  </div>`;
}
