import { addDays } from '../dates/calendar-day';
import {
  DOCUMENT_STALE_DAYS,
  expectedDocumentKinds,
  type DocumentKind,
  type DocumentStatusState,
} from './document-schema';

/** What a document kind is called inside a sentence ("No safety data sheet on file"). */
const KIND_IN_SENTENCE: Partial<Record<DocumentKind, string>> = {
  sds: 'safety data sheet',
  'ifra-certificate': 'IFRA certificate',
  'allergen-declaration': 'allergen declaration',
};

/** The least a document needs for its status: its kind and the day it was issued. */
interface DatedDocument {
  kind: DocumentKind;
  issuedOn: string;
}

/** One expected document kind of a material, with the document that decides its state. */
export interface DocumentStatusEntry<D extends DatedDocument> {
  kind: DocumentKind;
  state: DocumentStatusState;
  latest: D | null;
  message: string;
}

/**
 * Where each document a material of `category` should have stands on `today` (YYYY-MM-DD).
 * `documents` are the material's documents, newest issue first; the newest of each kind decides:
 * none is `missing`; one issued more than {@link DOCUMENT_STALE_DAYS} days ago is `out-of-date`;
 * one dated after today is `future-dated`, never current, because a date that has not come yet is
 * a typing mistake or a document not in force; anything else is `current`. The one rule behind a
 * material's document panel and the home page's attention list.
 */
export function documentStatusEntries<D extends DatedDocument>(
  category: string,
  documents: readonly D[],
  today: string,
): DocumentStatusEntry<D>[] {
  const cutoff = addDays(today, -DOCUMENT_STALE_DAYS);
  return expectedDocumentKinds(category).map((kind) => {
    const latest = documents.find((d) => d.kind === kind) ?? null;
    const label = KIND_IN_SENTENCE[kind] ?? kind;
    if (!latest) return { kind, state: 'missing', latest, message: `No ${label} on file` };
    if (latest.issuedOn > today) {
      return {
        kind,
        state: 'future-dated',
        latest,
        message: `The newest ${label} is dated ${latest.issuedOn}, after today: check its issue date`,
      };
    }
    if (latest.issuedOn < cutoff) {
      return {
        kind,
        state: 'out-of-date',
        latest,
        message: `The newest ${label} was issued on ${latest.issuedOn}, more than a year ago: ask the supplier for a current one`,
      };
    }
    return {
      kind,
      state: 'current',
      latest,
      message: `${label[0]!.toUpperCase()}${label.slice(1)} issued on ${latest.issuedOn}`,
    };
  });
}
