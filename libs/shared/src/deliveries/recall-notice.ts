/** Who the recipient replies to: the workshop's contact for this recall. */
export interface RecallNoticeContact {
  person?: string | null;
  email?: string | null;
  phone?: string | null;
}

/** What a recall notice says. */
export interface RecallNoticeInput {
  workshopName: string;
  productName: string;
  /** The finished lots' codes, as printed on the labels. */
  batchCodes: readonly string[];
  reason: string;
  /** Anything beyond the three standing steps (return by post, refund, dispose of it). */
  whatToDo?: string | null;
  contact: RecallNoticeContact;
  /** The customer's name, for the greeting. */
  customerName?: string | null;
}

/** A notice as plain text, ready for the mailer. */
export interface RecallNoticeText {
  subject: string;
  body: string;
}

/** Text on one line: a name typed with a line break must not break the subject or the layout. */
const oneLine = (text: string) => text.replace(/\s+/g, ' ').trim();

/**
 * The recall notice sent to a customer who received the lots: which batches, why, and the steps
 * (stop selling, set the stock aside, reply with the units on hand), then whom to answer. Plain
 * text, plain words: it says what happened and what to do, nothing else.
 */
export function recallNoticeText(input: RecallNoticeInput): RecallNoticeText {
  const product = oneLine(input.productName);
  const workshop = oneLine(input.workshopName);
  const codes = [...new Set(input.batchCodes.map(oneLine))];
  const batchWord = codes.length === 1 ? 'batch' : 'batches';
  const subject = `Recall: ${product}, ${batchWord} ${codes.join(', ')} - stop selling and reply`;
  const contact = input.contact;
  const reachBy = [contact.email, contact.phone].map((v) => (v ? oneLine(v) : '')).filter(Boolean);
  const whom = contact.person ? `${oneLine(contact.person)} at ${workshop}` : workshop;
  const extra = input.whatToDo?.trim();
  const lines = [
    input.customerName ? `Dear ${oneLine(input.customerName)},` : 'Hello,',
    '',
    `${workshop} is recalling ${product}, ${batchWord}:`,
    ...codes.map((code) => `  ${code}`),
    'The batch code is printed on each label.',
    '',
    `Why: ${input.reason.trim()}`,
    '',
    'Please, as soon as you read this:',
    `1. Stop selling ${codes.length === 1 ? 'this batch' : 'these batches'} and take any units off display.`,
    '2. Set the stock aside where it will not be sold or used.',
    '3. Reply with the number of units of each batch you still have, even if it is none.',
    ...(extra ? ['', extra] : []),
    '',
    reachBy.length > 0 ? `Reply to ${whom}: ${reachBy.join(' or ')}.` : `Reply to ${whom}.`,
    '',
    workshop,
  ];
  return { subject, body: lines.join('\n') };
}
