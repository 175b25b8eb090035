import { DOCUMENT_KINDS, type DocumentKind } from '@batchproof/shared';

/** What each kind of supplier document is called on screen. */
export const DOCUMENT_KIND_LABELS: Readonly<Record<DocumentKind, string>> = {
  sds: 'Safety data sheet',
  'certificate-of-analysis': 'Certificate of analysis',
  'ifra-certificate': 'IFRA conformity certificate',
  'allergen-declaration': 'Allergen declaration',
  specification: 'Specification',
  other: 'Other document',
};

/** Every kind with its label, in the shared order, for pickers. */
export const DOCUMENT_KIND_OPTIONS = DOCUMENT_KINDS.map((kind) => ({
  kind,
  label: DOCUMENT_KIND_LABELS[kind],
}));

/** A file size in plain words: `12 KB`, `1.4 MB`. */
export function fileSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1).replace(/\.0$/, '')} MB`;
}
