'use client';
/**
 * The printed pages of a batch of handouts, drawn cheaply enough for 500 workers while the page
 * stays responsive.
 *
 * Each page is /handout's own HandoutSheet for the worker's sheet (lib/checkups `batchHandout`).
 * Workers whose sheets differ only in their own results share a sheet key (lib/checkups
 * `batchSheetKey`): the sheet of a key is drawn by React once (a sheet of 2,000 icons is
 * thousands of elements), in a transition so the drawing is cut into short tasks, and each page
 * is a copy of it (`cloneNode`) with the worker's own results written into the copy's own-results
 * section: the section's paragraphs are copies of the drawn paragraph, one per sentence of the
 * worker's `ownResults` (the same list /handout prints), so the markup stays HandoutSheet's.
 *
 * Ids: the first page of a key keeps the drawn sheet's ids (prefixed per key) and its pictures'
 * definitions (the person symbol, the patterns); later copies drop their ids and definitions and
 * use the first page's, which are the same. Copies that kept them put 500 elements with one id
 * in the document, and each copy put in made the browser re-check every icon already there that
 * refers to that id (minutes for 500 pages); without them each page goes in on its own, at once.
 */
import { startTransition, useLayoutEffect, type ReactNode } from 'react';
import { createRoot } from 'react-dom/client';
import { HandoutSheet } from '@/app/components/handout/HandoutSheet';
import { BATCH_MESSAGES, type BatchHandout } from '@/lib/checkups/batchHandouts';
import type { HandoutSheet as HandoutSheetView } from '@/lib/handout';

export type SheetHandout = Extract<BatchHandout, { kind: 'sheet' }>;

/** The own-results section HandoutSheet draws (its test id). */
const OWN_RESULTS = '[data-testid="handout-own-results"]';

function Drawn({ onDrawn, children }: { onDrawn: () => void; children: ReactNode }) {
  useLayoutEffect(onDrawn, [onDrawn]);
  return children;
}

/** Draws a sheet with React off the document, in short tasks; resolves to a copy of the drawing. */
function drawSheet(sheet: HandoutSheetView, idPrefix: string): Promise<Element> {
  return new Promise((resolve, reject) => {
    const holder = document.createElement('div');
    const root = createRoot(holder);
    const onDrawn = () => {
      const drawn = holder.firstElementChild;
      // Unmounted in a task of its own, after this commit.
      window.setTimeout(() => root.unmount(), 0);
      if (drawn) resolve(drawn.cloneNode(true) as Element);
      else reject(new Error('the sheet was not drawn'));
    };
    startTransition(() => {
      root.render(
        <Drawn onDrawn={onDrawn}>
          <HandoutSheet sheet={sheet} idPrefix={idPrefix} />
        </Drawn>,
      );
    });
  });
}

/** Writes the worker's own results into a copy's own-results section, one paragraph per sentence. */
function writeOwnResults(sheet: Element, items: readonly string[]): void {
  const section = sheet.querySelector(OWN_RESULTS);
  const paragraphs = section ? [...section.querySelectorAll(':scope > p')] : [];
  const model = paragraphs[0];
  if (!section || !model) return;
  for (const p of paragraphs) p.remove();
  for (const text of items) {
    const p = model.cloneNode(false);
    p.textContent = text;
    section.append(p);
  }
}

/** Drops a copy's ids and its pictures' definitions: the first page of its key has them. */
function dropIds(sheet: Element): void {
  for (const defs of sheet.querySelectorAll('defs')) defs.remove();
  for (const element of sheet.querySelectorAll('[id]')) element.removeAttribute('id');
}

export interface PageDrawer {
  /** True when the sheet of this key is drawn already. */
  has(handout: SheetHandout): boolean;
  /** Draws the sheet of the handout's key (once per key), in short tasks. */
  draw(handout: SheetHandout): Promise<void>;
  /** The worker's page: a copy of their key's sheet with their own results and, if asked for, their id. */
  page(handout: SheetHandout): HTMLElement;
}

export function createPageDrawer(): PageDrawer {
  const drawn = new Map<string, { readonly sheet: Element; copies: number }>();
  return {
    has: (handout) => drawn.has(handout.sheetKey),
    async draw(handout) {
      if (drawn.has(handout.sheetKey)) return;
      const sheet = await drawSheet(handout.sheet, `batch-${drawn.size}-`);
      drawn.set(handout.sheetKey, { sheet, copies: 0 });
    },
    page(handout) {
      const found = drawn.get(handout.sheetKey);
      if (!found) throw new Error('draw the sheet before its pages');
      const sheet = found.sheet.cloneNode(true) as Element;
      if (found.copies > 0) dropIds(sheet);
      found.copies++;
      if (handout.sheet.ownResults) writeOwnResults(sheet, handout.sheet.ownResults.items);
      const page = document.createElement('div');
      page.className = 'batch-print__page';
      page.append(sheet);
      if (handout.workerId !== undefined) {
        // In small print at the right of the sheet's title line, where it takes no height of its own.
        const id = document.createElement('p');
        id.className = 'batch-print__id';
        id.textContent = BATCH_MESSAGES.idLine(handout.workerId);
        (sheet.querySelector('.sheet__header') ?? page).append(id);
      }
      return page;
    },
  };
}
