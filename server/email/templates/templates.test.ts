import { describe, expect, it } from 'vitest';
import { formatGigabytes, formatUtcDateTime } from './format';
import { invitationEmail } from './invitation-email';
import { usageThresholdEmail } from './usage-threshold-email';

const NBSP = '\u00a0';

describe('formatUtcDateTime', () => {
  // 2026-03-14T10:30+01:00 is 09:30 UTC (ISO 8601 offset arithmetic).
  it('states the instant in UTC whatever the input offset', () => {
    expect(formatUtcDateTime(new Date('2026-03-14T10:30:00+01:00'))).toBe('14 March 2026 at 09:30 UTC');
  });
});

describe('formatGigabytes', () => {
  // Decimal prefix: 1 GB = 10^9 bytes (SI prefix giga, BIPM SI Brochure 9th ed. Table 7).
  it('uses decimal gigabytes', () => {
    expect(formatGigabytes(80_500_000_000)).toBe(`80.5${NBSP}GB`);
  });
});

describe('invitationEmail', () => {
  const input = {
    organisationName: 'Kestrel Bay Acoustics',
    inviterName: 'Maren Solberg',
    role: 'admin' as const,
    acceptUrl: 'http://127.0.0.1:5173/invitations/accept?token=abc&org=kb',
    expiresAt: new Date(Date.UTC(2026, 2, 21, 17, 5)),
  };

  it('names the inviter, organisation, role, link and expiry in the text', () => {
    const { subject, text } = invitationEmail(input);
    expect(subject).toBe('You are invited to join Kestrel Bay Acoustics on Sweepline');
    expect(text).toContain('Maren Solberg has invited you to join Kestrel Bay Acoustics on Sweepline as an admin.');
    expect(text).toContain(`Accept the invitation:\n${input.acceptUrl}\n`);
    expect(text).toContain('The link expires on 21 March 2026 at 17:05 UTC.');
  });

  it('uses "a" before a consonant-initial role', () => {
    expect(invitationEmail({ ...input, role: 'viewer' }).text).toContain('as a viewer.');
  });

  it('escapes names and links in the HTML', () => {
    const { html } = invitationEmail({ ...input, organisationName: 'Bay <Lab> & "Co"' });
    expect(html).toContain('Bay &lt;Lab&gt; &amp; &quot;Co&quot;');
    expect(html).not.toContain('<Lab>');
    expect(html).toContain('href="http://127.0.0.1:5173/invitations/accept?token=abc&amp;org=kb"');
  });
});

describe('usageThresholdEmail', () => {
  const base = {
    organisationName: 'Kestrel Bay Acoustics',
    planName: 'Line',
    limit: 6_000,
    periodEndsAt: new Date(Date.UTC(2026, 3, 1, 0, 0)),
    usageUrl: 'http://127.0.0.1:5173/settings/usage',
  };

  it('at 80 % says how much is used and when it resets', () => {
    const { subject, text } = usageThresholdEmail({ ...base, metric: 'audio_minutes', used: 4_812, thresholdPercent: 80 });
    expect(subject).toBe(`Kestrel Bay Acoustics has used 80${NBSP}% of its audio minutes on Sweepline`);
    // 4812 / 6000 = 0.802 → 80 %.
    expect(text).toContain(`has used 4,812 min of the 6,000 min of audio minutes included in the Line plan (80${NBSP}%).`);
    expect(text).toContain('The period resets on 1 April 2026 at 00:00 UTC.');
    expect(text).toContain(base.usageUrl);
  });

  it('at 100 % says what is refused until the reset', () => {
    const { subject, text } = usageThresholdEmail({
      ...base,
      metric: 'storage_bytes',
      used: 100e9,
      limit: 100e9,
      thresholdPercent: 100,
    });
    expect(subject).toBe('Kestrel Bay Acoustics has reached its storage limit on Sweepline');
    expect(text).toContain(`100${NBSP}GB of the 100${NBSP}GB of storage`);
    expect(text).toContain('New uploads are refused until the period resets on 1 April 2026 at 00:00 UTC');
  });
});
