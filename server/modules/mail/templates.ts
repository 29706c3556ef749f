import type { Role } from '@/lib/schemas/groups';
import type { OutgoingMail } from './mailer';

/** Sphereline's own wording for every message; each has a plain-text and an HTML part. */

const escapeHtml = (value: string) =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

const roleWords: Record<Role, string> = {
  viewer: 'viewer (reads accepted entries)',
  contributor: 'contributor (drafts and submits entries)',
  curator: 'curator (reviews entries and keeps the ligand catalogue)',
  admin: 'admin (manages members, roles and invitations)',
};

interface Block {
  greeting: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  after?: string[];
}

function render(to: string, subject: string, block: Block): OutgoingMail {
  const footer = 'Sphereline — lability and electron-transfer routes for coordination chemists.';
  const text = [
    block.greeting,
    '',
    ...block.paragraphs.flatMap((p) => [p, '']),
    ...(block.action ? [`${block.action.label}:`, block.action.url, ''] : []),
    ...(block.after ?? []).flatMap((p) => [p, '']),
    '-- ',
    footer,
  ].join('\n');
  const html = [
    '<!doctype html><html><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #1d2430">',
    `<p>${escapeHtml(block.greeting)}</p>`,
    ...block.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    ...(block.action
      ? [
          `<p><a href="${escapeHtml(block.action.url)}" style="display: inline-block; padding: 10px 16px; background: #2f5d8a; color: #ffffff; border-radius: 6px; text-decoration: none">${escapeHtml(block.action.label)}</a></p>`,
          `<p style="font-size: 13px; color: #5a6472">Or copy this address into your browser: ${escapeHtml(block.action.url)}</p>`,
        ]
      : []),
    ...(block.after ?? []).map((p) => `<p>${escapeHtml(p)}</p>`),
    `<hr><p style="font-size: 12px; color: #5a6472">${escapeHtml(footer)}</p>`,
    '</body></html>',
  ].join('\n');
  return { to, subject, text, html };
}

export function verifyEmailMail(to: string, displayName: string, url: string, hours: number): OutgoingMail {
  return render(to, 'Sphereline: confirm your e-mail address', {
    greeting: `Hello ${displayName},`,
    paragraphs: ['Welcome to Sphereline. Please confirm that this address is yours before you sign in.'],
    action: { label: 'Confirm my address', url },
    after: [`The link works once and for ${hours} hours. If you did not sign up, ignore this message.`],
  });
}

export function alreadyRegisteredMail(to: string, displayName: string, signInUrl: string, resetUrl: string): OutgoingMail {
  return render(to, 'Sphereline: you already have an account', {
    greeting: `Hello ${displayName},`,
    paragraphs: [
      'Someone (perhaps you) tried to create a Sphereline account with this address, but an account already exists. No new account was made.',
      `Sign in at ${signInUrl}`,
    ],
    action: { label: 'Forgot your password? Choose a new one', url: resetUrl },
    after: ['If it was not you, you can ignore this message: your account is unchanged.'],
  });
}

export function resetPasswordMail(to: string, displayName: string, url: string, minutes: number): OutgoingMail {
  return render(to, 'Sphereline: choose a new password', {
    greeting: `Hello ${displayName},`,
    paragraphs: ['Someone asked to reset the password of your Sphereline account. If it was you, choose a new password here.'],
    action: { label: 'Choose a new password', url },
    after: [
      `The link works once and for ${minutes} minutes. Choosing a new password signs you out on every device.`,
      'If you did not ask for this, ignore this message: your password is unchanged.',
    ],
  });
}

/** After any change of the password (ASVS V2.2.3): the owner hears of it even if it was not them. */
export function passwordChangedMail(to: string, displayName: string, how: 'changed' | 'reset', resetUrl: string): OutgoingMail {
  return render(to, 'Sphereline: your password was changed', {
    greeting: `Hello ${displayName},`,
    paragraphs: [
      how === 'changed'
        ? 'The password of your Sphereline account was just changed from the account page. Other devices where you were signed in have been signed out.'
        : 'The password of your Sphereline account was just reset with a link sent to this address. You have been signed out on every device.',
    ],
    action: { label: 'Not you? Choose a new password now', url: resetUrl },
    after: ['If it was you, there is nothing more to do.'],
  });
}

export function resetUnknownAddressMail(to: string, signUpUrl: string): OutgoingMail {
  return render(to, 'Sphereline: password reset requested', {
    greeting: 'Hello,',
    paragraphs: [
      'Someone asked to reset the password of a Sphereline account for this address, but there is no account with this address.',
      `If you meant to create one, sign up at ${signUpUrl}`,
    ],
    after: ['If it was not you, ignore this message.'],
  });
}

export function invitationMail(
  to: string,
  details: { groupName: string; role: Role; inviterName: string; url: string; days: number },
): OutgoingMail {
  // The group's name is free text: it is quoted in the body and kept out of the subject.
  return render(to, 'Sphereline: an invitation to a research group', {
    greeting: 'Hello,',
    paragraphs: [
      `${details.inviterName} invites you to join "${details.groupName}" on Sphereline as ${roleWords[details.role]}.`,
      'Sphereline keeps the group\'s curated library of complexes, measured rate constants and their citations.',
    ],
    action: { label: 'See the invitation', url: details.url },
    after: [
      `The invitation works once and for ${details.days} days. Accept it signed in with this address (${to}), or sign up with it first.`,
    ],
  });
}
