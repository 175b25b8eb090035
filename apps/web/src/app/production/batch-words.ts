import type { BatchState } from '@batchproof/shared';

/** A batch's state in words, with an icon, so it never rests on colour alone. */
export const STATE_WORDS: Record<BatchState, { word: string; icon: string }> = {
  draft: { word: 'Draft', icon: 'edit_note' },
  released: { word: 'Released', icon: 'verified' },
};

/** A check's result in words. */
export const CHECK_WORDS = {
  pass: 'Pass',
  fail: 'Fail',
  'not-checked': 'Not checked',
} as const;
