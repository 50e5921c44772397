import type { JSONContent } from '@tiptap/react';

export interface Draft {
  fields: {
    title: string;
    subsystem: string;
    seasonId: string;
    source: string;
    calculationIds: string[];
    relatedRecordIds: string[];
  };
  body: JSONContent;
  baseVersion: number;
  savedAt: string;
}

export function draftKey(recordId: string | undefined, kind: string): string {
  return `wakebook:draft:${recordId ?? `new-${kind}`}`;
}

export function readDraft(key: string): Draft | null {
  try {
    const raw = window.localStorage.getItem(key);
    return raw ? (JSON.parse(raw) as Draft) : null;
  } catch {
    return null;
  }
}

export function writeDraft(key: string, draft: Draft): void {
  try {
    window.localStorage.setItem(key, JSON.stringify(draft));
  } catch {
    // Storage full or blocked: the editor still holds the text; saving to the server still works.
  }
}

export function clearDraft(key: string): void {
  try {
    window.localStorage.removeItem(key);
  } catch {
    // nothing to clear
  }
}
