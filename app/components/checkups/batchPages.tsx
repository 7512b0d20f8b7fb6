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
 * The pictures: a sheet's two icon arrays are up to 2,000 icons, each an SVG `<use>` element
 * that the browser expands on its own; 500 pages of them (a million elements) took minutes to
 * put in and to print. So in the drawn sheet each picture — the very SVG IconArray drew — is
 * written out once (XMLSerializer) and shown as an image of itself (blob: URLs; a large picture
 * as a stack of strips, see pictureTexts), in a box with the picture's class, so it is sized as
 * on /handout, and its text alternative; the PDF keeps it as vector drawing. Every page of the
 * key shows those images.
 *
 * Ids: the first page of a key keeps the drawn sheet's ids (prefixed per key) and the key's
 * definitions (the legend's patterns); later copies drop their ids and definitions and use the
 * first page's, which are the same. Copies that kept them put 500 elements with one id in the
 * document, and each copy put in made the browser re-check every element there that refers to
 * that id; without them each page goes in on its own, at once.
 */
import { startTransition, useLayoutEffect, type ReactNode } from 'react';
import { createRoot, type Root } from 'react-dom/client';
import { HandoutSheet } from '@/app/components/handout/HandoutSheet';
import { BATCH_MESSAGES, type BatchHandout } from '@/lib/checkups/batchHandouts';
import type { HandoutSheet as HandoutSheetView } from '@/lib/handout';

export type SheetHandout = Extract<BatchHandout, { kind: 'sheet' }>;

/** The own-results section HandoutSheet draws (its test id). */
const OWN_RESULTS = '[data-testid="handout-own-results"]';

/** Lets the browser handle input and draw before going on (a task of its own, no 4 ms clamp). */
export function nextTask(): Promise<void> {
  return new Promise((resolve) => {
    const channel = new MessageChannel();
    channel.port1.onmessage = () => resolve();
    channel.port2.postMessage(null);
  });
}

function Drawn({ onDrawn, children }: { onDrawn: () => void; children: ReactNode }) {
  useLayoutEffect(onDrawn, [onDrawn]);
  return children;
}

/** A picture with more icons than this is shown as strips, one per block of rows. */
const ICONS_PER_IMAGE = 60;

/**
 * A drawn picture (IconArray's SVG) as standalone SVG texts, top to bottom, made one at a time.
 * A picture of up to {@link ICONS_PER_IMAGE} icons is one text; a larger one is cut at the blank
 * gaps between its blocks of rows into strips, each with the same definitions, the icons and
 * range tiles whose top lies in it, and the same width: the browser reads an SVG image all at
 * once, and 1,000 icons took it 100 to 350 ms here, a strip of 125 a tenth of that. The cuts lie
 * midway in the gaps, where nothing is drawn, so the strips stacked are the picture.
 */
function* pictureTexts(svg: Element): Generator<string> {
  const serialize = (element: Element) => new XMLSerializer().serializeToString(element);
  const viewBox = (svg.getAttribute('viewBox') ?? '').split(/\s+/).map(Number);
  const [x, y, width, height] = viewBox;
  const icons = [...svg.querySelectorAll('use')];
  if (viewBox.length !== 4 || viewBox.some((v) => !Number.isFinite(v)) || x === undefined || y === undefined || width === undefined || height === undefined || icons.length <= ICONS_PER_IMAGE) {
    yield serialize(svg);
    return;
  }
  const rows = [...new Set(icons.map((u) => Number(u.getAttribute('y'))))].sort((a, b) => a - b);
  const iconHeight = Number(icons[0]?.getAttribute('height'));
  const step = Math.min(...rows.slice(1).map((r, i) => r - (rows[i] ?? r)));
  const cuts: number[] = [];
  rows.forEach((row, i) => {
    const next = rows[i + 1];
    if (next !== undefined && next - row > step + 1e-9) cuts.push((row + iconHeight + next) / 2);
  });
  const edges = [y, ...cuts, y + height];
  for (let k = 0; k + 1 < edges.length; k++) {
    const top = edges[k] ?? y;
    const bottom = edges[k + 1] ?? y + height;
    const keep = (element: Element): Element => {
      const copy = element.cloneNode(false) as Element;
      for (const child of element.children) {
        if (child.tagName.toLowerCase() === 'defs') copy.append(child.cloneNode(true));
        else if (child.hasAttribute('y')) {
          const at = Number(child.getAttribute('y'));
          if (at >= top && at < bottom) copy.append(child.cloneNode(true));
        } else copy.append(keep(child));
      }
      return copy;
    };
    const strip = keep(svg);
    strip.setAttribute('viewBox', `${x} ${top} ${width} ${bottom - top}`);
    yield serialize(strip);
  }
}

/**
 * Replaces each picture of a drawn sheet by an image of itself (a stack of strips for a large
 * one, see {@link pictureTexts}), in a box of the picture's class and proportions so it is sized
 * as on /handout, carrying the picture's text alternative; one image per task, each waited for
 * until the browser has read it (so a print made at once has it). Returns the blob: URLs it made.
 */
async function picturesAsImages(sheet: Element, images: Map<string, string>): Promise<string[]> {
  const made: string[] = [];
  for (const svg of [...sheet.querySelectorAll('svg.icon-array__picture')]) {
    await nextTask();
    const box = document.createElement('div');
    box.className = svg.getAttribute('class') ?? '';
    const [, , width, height] = (svg.getAttribute('viewBox') ?? '').split(/\s+/).map(Number);
    if (width && height) box.style.aspectRatio = `${width} / ${height}`;
    box.setAttribute('role', 'img');
    const labelledBy = svg.getAttribute('aria-labelledby');
    if (labelledBy) box.setAttribute('aria-labelledby', labelledBy);
    // The strips are made from the drawn picture, one per task, before it leaves the sheet.
    const strips = pictureTexts(svg);
    svg.after(box);
    for (const text of strips) {
      // Equal images (in another key's sheet too) share one URL: the browser reads each once.
      let url = images.get(text);
      if (url === undefined) {
        url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' }));
        images.set(text, url);
        made.push(url);
      }
      const img = document.createElement('img');
      img.className = 'batch-print__strip';
      img.alt = '';
      img.src = url;
      box.append(img);
      await img.decode().catch(() => undefined);
      await nextTask();
    }
    svg.remove();
  }
  return made;
}

/**
 * Draws a sheet with React off the document, in a transition (the work is cut into short tasks);
 * resolves, in a task after React's, to the drawn element and its root (unmounted when done).
 */
function drawSheet(sheet: HandoutSheetView, idPrefix: string): Promise<{ readonly element: Element; readonly root: Root }> {
  return new Promise((resolve, reject) => {
    const holder = document.createElement('div');
    const root = createRoot(holder);
    const onDrawn = () => {
      const element = holder.firstElementChild;
      if (element) void nextTask().then(() => resolve({ element, root }));
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

/**
 * The on-screen table of the groups (HandoutSheet's GroupsTable) is never printed (handout.css
 * hides it on paper) and batch pages are never on screen: left out, it is not copied 500 times.
 */
function dropScreenOnly(sheet: Element): void {
  for (const table of sheet.querySelectorAll('.sheet__table')) table.remove();
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
  /** Lets go of the pictures' images (when the prepared pages are cleared). */
  dispose(): void;
  /** True when the sheet of this key is drawn already. */
  has(handout: SheetHandout): boolean;
  /** Draws the sheet of the handout's key (once per key), in short tasks. */
  draw(handout: SheetHandout): Promise<void>;
  /** The worker's page: a copy of their key's sheet with their own results and, if asked for, their id. */
  page(handout: SheetHandout): HTMLElement;
}

export function createPageDrawer(): PageDrawer {
  const drawn = new Map<string, { readonly sheet: Element; copies: number }>();
  const roots: Root[] = [];
  const images = new Map<string, string>();
  let disposed = false;
  return {
    dispose() {
      disposed = true;
      for (const url of images.values()) URL.revokeObjectURL(url);
      images.clear();
      drawn.clear();
      // Not while React is committing (dispose runs in an effect's clean-up): in a task of its own.
      const done = roots.splice(0);
      window.setTimeout(() => {
        for (const root of done) root.unmount();
      }, 0);
    },
    has: (handout) => drawn.has(handout.sheetKey),
    async draw(handout) {
      if (drawn.has(handout.sheetKey)) return;
      // The drawn element itself is the key's model (React draws it once and never again).
      const { element: sheet, root } = await drawSheet(handout.sheet, `batch-${drawn.size}-`);
      roots.push(root);
      dropScreenOnly(sheet);
      const made = await picturesAsImages(sheet, images);
      if (disposed) {
        for (const url of made) URL.revokeObjectURL(url);
        for (const r of roots.splice(0)) r.unmount();
        return;
      }
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
