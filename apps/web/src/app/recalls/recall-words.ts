import type { RecallNoticeStatus, RecallSeverity } from '@batchproof/shared';

/** Short words for the severity in tables; the full sentence is `RECALL_SEVERITY_LABELS`. */
export const SEVERITY_WORDS: Readonly<Record<RecallSeverity, { word: string; icon: string }>> = {
  'serious-harm': { word: 'Serious harm', icon: 'report' },
  'minor-harm': { word: 'Minor harm', icon: 'warning' },
  'unlikely-harm': { word: 'Harm unlikely', icon: 'info' },
};

/** A notice's status in words, with an icon so it never rests on colour alone. */
export const NOTICE_WORDS: Readonly<Record<RecallNoticeStatus, { word: string; icon: string }>> = {
  sent: { word: 'Sent', icon: 'mark_email_read' },
  failed: { word: 'Failed', icon: 'error' },
  'not-sent': { word: 'Not sent', icon: 'phone' },
  drill: { word: 'Drill: not sent', icon: 'school' },
};
