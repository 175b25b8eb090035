import type { Role } from '@batchproof/shared';
import type { OutgoingMail } from './mailer';

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

function wrap(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('');
  return `<!doctype html><html><body style="font-family:sans-serif;line-height:1.5">${body}<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p></body></html>`;
}

/** The invitation a workshop owner sends to a new member. */
export function invitationMail(input: {
  to: string;
  workshopName: string;
  inviterName: string;
  role: Role;
  link: string;
  days: number;
}): OutgoingMail {
  const lines = [
    `${input.inviterName} has invited you to join ${input.workshopName} on Batchproof as ${input.role}.`,
    `Open the link below to choose your password. It works once and expires in ${input.days} days.`,
  ];
  return {
    to: input.to,
    subject: `Join ${input.workshopName} on Batchproof`,
    text: `${lines.join('\n\n')}\n\n${input.link}\n`,
    html: wrap(lines, { href: input.link, label: 'Accept the invitation' }),
  };
}

/** The password-reset link. */
export function passwordResetMail(input: {
  to: string;
  link: string;
  minutes: number;
}): OutgoingMail {
  const lines = [
    'Someone asked to reset the password of your Batchproof account.',
    `Open the link below within ${input.minutes} minutes to choose a new one. If it was not you, ignore this e-mail; your password stays as it is.`,
  ];
  return {
    to: input.to,
    subject: 'Reset your Batchproof password',
    text: `${lines.join('\n\n')}\n\n${input.link}\n`,
    html: wrap(lines, { href: input.link, label: 'Choose a new password' }),
  };
}

/** The link that confirms a new workshop's e-mail; the workshop is created when it is opened. */
export function confirmSignUpMail(input: {
  to: string;
  workshopName: string;
  link: string;
  hours: number;
}): OutgoingMail {
  const lines = [
    `Someone asked to set up ${input.workshopName} on Batchproof with this e-mail address.`,
    `Open the link below within ${input.hours} hours to confirm the address and start using your workshop. If it was not you, ignore this e-mail and nothing is created.`,
  ];
  return {
    to: input.to,
    subject: `Confirm your e-mail to set up ${input.workshopName}`,
    text: `${lines.join('\n\n')}\n\n${input.link}\n`,
    html: wrap(lines, { href: input.link, label: 'Confirm and open Batchproof' }),
  };
}

/**
 * Sent instead of a confirmation when someone signs up with an address that already has an
 * account: the owner of the address learns of it, the person signing up learns nothing.
 */
export function accountExistsMail(input: { to: string; resetLink: string }): OutgoingMail {
  const lines = [
    'Someone tried to set up a new Batchproof workshop with this e-mail address, which already has an account. No new workshop was created.',
    'If it was you, sign in with your password as usual; if you have forgotten it, choose a new one with the link below. If it was not you, ignore this e-mail; your account is unchanged.',
  ];
  return {
    to: input.to,
    subject: 'Your Batchproof account already exists',
    text: `${lines.join('\n\n')}\n\n${input.resetLink}\n`,
    html: wrap(lines, { href: input.resetLink, label: 'Choose a new password' }),
  };
}

/** Tells an assessor that a workshop shared a formula version with them for safety assessment. */
export function versionSharedMail(input: {
  to: string;
  workshopName: string;
  sharedByName: string;
  formulaName: string;
  versionNumber: number;
  link: string;
}): OutgoingMail {
  const lines = [
    `${input.sharedByName} of ${input.workshopName} has shared ${input.formulaName}, version ${input.versionNumber}, with you for its safety assessment.`,
    `Open Assessments in Batchproof (switch to ${input.workshopName} if you work for several workshops) to read the packet and start the assessment.`,
  ];
  return {
    to: input.to,
    subject: `${input.workshopName} shared ${input.formulaName} (version ${input.versionNumber}) for assessment`,
    text: `${lines.join('\n\n')}\n\n${input.link}\n`,
    html: wrap(lines, { href: input.link, label: 'Open Assessments' }),
  };
}
