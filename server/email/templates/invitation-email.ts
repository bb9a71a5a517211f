import type { EmailContent } from './email-content';
import { formatUtcDateTime } from './format';
import { htmlActionLink, htmlDocument, htmlParagraph, PRODUCT_NAME, textDocument } from './layout';

export type InvitedRole = 'owner' | 'admin' | 'analyst' | 'viewer';

export interface InvitationEmailInput {
  organisationName: string;
  /** Display name of the member who sent the invitation. */
  inviterName: string;
  role: InvitedRole;
  /** Single-use link that signs the person up or adds them to the organisation. */
  acceptUrl: string;
  expiresAt: Date;
}

const ROLE_DESCRIPTIONS: Record<InvitedRole, string> = {
  owner: 'Owners manage the organisation, its members, API keys, billing and all measurement data.',
  admin: 'Admins manage members, API keys, webhooks and the plan, and work with all measurement data.',
  analyst: 'Analysts upload captures, run analyses and manage calibrations and tolerance masks.',
  viewer: 'Viewers can read analyses, results and reports but cannot change anything.',
};

function withArticle(role: InvitedRole): string {
  return /^[aeiou]/.test(role) ? `an ${role}` : `a ${role}`;
}

export function invitationEmail(input: InvitationEmailInput): EmailContent {
  const { organisationName, inviterName, role, acceptUrl, expiresAt } = input;
  const subject = `You are invited to join ${organisationName} on ${PRODUCT_NAME}`;
  const invitation = `${inviterName} has invited you to join ${organisationName} on ${PRODUCT_NAME} as ${withArticle(role)}.`;
  const about =
    `${PRODUCT_NAME} is the measurement-analysis service ${organisationName} uses to turn test-rig captures ` +
    'into frequency-response, sensitivity and distortion results.';
  const expiry = `The link expires on ${formatUtcDateTime(expiresAt)}. After that, ask an administrator of ${organisationName} to send a new invitation.`;
  const notExpected = 'If you were not expecting this invitation you can ignore this e-mail; nothing is created unless you accept.';
  const footer = `Sent by ${PRODUCT_NAME} on behalf of ${organisationName}.`;

  const text = textDocument(
    ['Hello,', invitation, ROLE_DESCRIPTIONS[role], about, `Accept the invitation:\n${acceptUrl}`, expiry, notExpected],
    footer,
  );
  const html = htmlDocument(
    subject,
    [
      htmlParagraph('Hello,'),
      htmlParagraph(invitation),
      htmlParagraph(ROLE_DESCRIPTIONS[role]),
      htmlParagraph(about),
      htmlActionLink('Accept the invitation', acceptUrl),
      htmlParagraph(expiry),
      htmlParagraph(notExpected),
    ],
    footer,
  );
  return { subject, text, html };
}
