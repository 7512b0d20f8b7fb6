'use client';
/**
 * The handout screen's saved templates: the list (re-read whenever any tab changes it), the
 * template taken up with "Use template" (its id and revision, so a save is an edit of what was
 * taken up), and the panel's actions. The library is loaded on demand, as on the consultation
 * screen. Every action resolves to what the panel says: a message, or the issues.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import {
  afterTemplateRefusal,
  TEMPLATE_MESSAGES,
  type Clinic,
  type HandoutBlocks,
  type TakenTemplate,
  type TemplateRecord,
} from '@/lib/handout';
import type { Issue } from '@/lib/result';
import { createTemplateStore, moveLegacyTemplates, onTemplatesChanged, type TemplateStore } from './templateStore';

/** What an action tells the educator. */
export interface TemplateOutcome {
  readonly message?: string;
  readonly issues?: readonly Issue[];
}

export interface TemplateActions {
  readonly templates: readonly TemplateRecord[];
  readonly loadIssues: readonly Issue[];
  /** Whether the library has been opened (the panel's buttons wait for it). */
  readonly ready: boolean;
  use(record: TemplateRecord): string;
  save(name: string, blocks: HandoutBlocks, clinic: Clinic): Promise<TemplateOutcome>;
  rename(id: string, to: string): Promise<TemplateOutcome>;
  remove(record: TemplateRecord): Promise<TemplateOutcome>;
  exportFile(): Promise<TemplateOutcome & { readonly text?: string }>;
  importFile(text: string): Promise<TemplateOutcome>;
}

const UNAVAILABLE: readonly Issue[] = [{ code: 'storage-unavailable', path: [], message: TEMPLATE_MESSAGES.storageUnavailable }];

export function useTemplates(): TemplateActions {
  const [store, setStore] = useState<TemplateStore | undefined>(undefined);
  const [templates, setTemplates] = useState<readonly TemplateRecord[]>([]);
  const [loadIssues, setLoadIssues] = useState<readonly Issue[]>([]);
  const taken = useRef<TakenTemplate | undefined>(undefined);

  const refresh = useCallback(async (from: TemplateStore, extra: readonly Issue[] = []) => {
    const listed = await from.list();
    if (listed.ok) {
      setTemplates(listed.value.records);
      setLoadIssues([...extra, ...listed.value.problems]);
      return listed.value.records;
    }
    setLoadIssues([...extra, ...listed.issues]);
    return undefined;
  }, []);

  useEffect(() => {
    let live = true;
    let unsubscribe: (() => void) | undefined;
    void import('@/app/storage/library').then(async ({ openLibrary }) => {
      const opened = await openLibrary();
      if (!live) {
        if (opened.ok) opened.value.close();
        return;
      }
      if (!opened.ok) {
        setLoadIssues(opened.issues);
        return;
      }
      const created = createTemplateStore(opened.value);
      const moved = typeof window === 'undefined' ? undefined : await moveLegacyTemplates(created, window.localStorage);
      if (!live) return;
      setStore(created);
      await refresh(created, moved && !moved.ok ? moved.issues : []);
      unsubscribe = onTemplatesChanged(() => void refresh(created));
    });
    return () => {
      live = false;
      unsubscribe?.();
    };
  }, [refresh]);

  async function refused(from: TemplateStore, issues: readonly Issue[]): Promise<TemplateOutcome> {
    const records = (await refresh(from)) ?? templates;
    const after = afterTemplateRefusal(taken.current, issues, records);
    taken.current = after.taken;
    return { issues: after.issues };
  }

  return {
    templates,
    loadIssues,
    ready: store !== undefined,
    use(record) {
      taken.current = { id: record.id, revision: record.revision, name: record.template.name };
      return TEMPLATE_MESSAGES.using(record.template.name);
    },
    async save(name, blocks, clinic) {
      if (!store) return { issues: UNAVAILABLE };
      const saved = await store.save(taken.current, { name, blocks, clinic });
      if (!saved.ok) return refused(store, saved.issues);
      taken.current = { id: saved.value.id, revision: saved.value.revision, name: saved.value.template.name };
      await refresh(store);
      return { message: TEMPLATE_MESSAGES.saved(saved.value.template.name) };
    },
    async rename(id, to) {
      if (!store) return { issues: UNAVAILABLE };
      const from = templates.find((t) => t.id === id)?.template.name ?? '';
      const renamed = await store.rename(taken.current, id, to);
      if (!renamed.ok) return refused(store, renamed.issues);
      if (taken.current?.id === id) taken.current = { id, revision: renamed.value.revision, name: renamed.value.template.name };
      await refresh(store);
      return { message: TEMPLATE_MESSAGES.renamed(from, renamed.value.template.name) };
    },
    async remove(record) {
      if (!store) return { issues: UNAVAILABLE };
      const removed = await store.remove(record.id);
      await refresh(store);
      if (!removed.ok) return { issues: removed.issues };
      if (taken.current?.id === record.id) taken.current = undefined;
      return { message: TEMPLATE_MESSAGES.deleted(record.template.name) };
    },
    async exportFile() {
      if (!store) return { issues: UNAVAILABLE };
      const text = await store.exportFile();
      return text.ok ? { message: TEMPLATE_MESSAGES.exported, text: text.value } : { issues: text.issues };
    },
    async importFile(text) {
      if (!store) return { issues: UNAVAILABLE };
      const imported = await store.importFile(text);
      if (!imported.ok) return { issues: imported.issues, message: TEMPLATE_MESSAGES.importRefused };
      await refresh(store);
      return { message: TEMPLATE_MESSAGES.imported(imported.value) };
    },
  };
}
