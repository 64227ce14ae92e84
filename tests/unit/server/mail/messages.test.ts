import { describe, expect, it } from 'vitest';
import { loadEnv } from '@server/config/env.ts';
import { composeEmail, escapeHtml, type EmailContent } from '@server/mail/compose-email.ts';
import { driftAlertEmail } from '@server/mail/messages/drift-alert-email.ts';
import { promotedEmail, reinstatedEmail } from '@server/mail/messages/incumbent-emails.ts';
import { invitationEmail } from '@server/mail/messages/invitation-email.ts';
import {
  awaitsReviewEmail,
  clearedEmail,
  sentBackEmail,
  signedOffEmail,
} from '@server/mail/messages/review-emails.ts';
import { safetyCaution } from '@shared/safety-caution.ts';

const env = loadEnv({ PUBLIC_URL: 'https://stablehand.frame.example/' });
/** A value that breaks HTML unless escaped, with a line break that must not reach a subject. */
const hostile = `<script>alert("x")</script> & 'Ω'\nBcc: someone`;
const escaped = `&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;Ω&#39;`;

const candidate = {
  teamSlug: 'frame-solvers',
  candidateId: 42,
  candidateTitle: hostile,
  routineTitle: hostile,
  revisionNumber: 3,
};
const routine = {
  teamSlug: 'frame-solvers',
  routineId: 7,
  routineTitle: hostile,
  teamName: hostile,
};
const candidateUrl = 'https://stablehand.frame.example/teams/frame-solvers/candidates/42';
const logbookUrl = 'https://stablehand.frame.example/teams/frame-solvers/routines/7/logbook';

const cases: [string, EmailContent, string][] = [
  [
    'invitation',
    invitationEmail(env, {
      teamName: hostile,
      role: 'reviewer',
      inviterName: hostile,
      token: 'tok&en/1',
      expiresAt: new Date('2027-03-04T12:00:00Z'),
    }),
    'https://stablehand.frame.example/invitations/tok%26en%2F1',
  ],
  ['awaits review', awaitsReviewEmail(env, { ...candidate, authorName: hostile }), candidateUrl],
  [
    'sent back',
    sentBackEmail(env, { ...candidate, reviewerName: hostile, reason: hostile }),
    candidateUrl,
  ],
  [
    'signed off',
    signedOffEmail(env, { ...candidate, reviewerName: hostile, signOffs: 1, signOffsNeeded: 2 }),
    candidateUrl,
  ],
  ['cleared', clearedEmail(env, { ...candidate, authorName: hostile }), candidateUrl],
  [
    'promoted',
    promotedEmail(env, {
      ...routine,
      maintainerName: hostile,
      note: hostile,
      candidateTitle: hostile,
      revisionNumber: 3,
    }),
    logbookUrl,
  ],
  [
    'reinstated',
    reinstatedEmail(env, { ...routine, maintainerName: hostile, note: '', revisionLabel: hostile }),
    logbookUrl,
  ],
  [
    'drift alert',
    driftAlertEmail(env, {
      ...routine,
      findings: [hostile, 'n = 256: 1.8× slower'],
      checkedAt: new Date('2027-03-05T03:00:00Z'),
    }),
    logbookUrl,
  ],
];

describe.each(cases)('%s e-mail', (_name, content, link) => {
  it('escapes every interpolated value in the HTML', () => {
    expect(content.html).not.toContain('<script>');
    expect(content.html).not.toContain('"x"');
    expect(content.html).toContain(escaped);
  });

  it('keeps the plain text readable and the subject on one line', () => {
    expect(content.text).toContain('<script>alert("x")</script>');
    expect(content.subject).not.toMatch(/[\r\n]/);
    expect(content.subject).toContain('<script>');
  });

  it('links to its page in both bodies', () => {
    expect(content.text).toContain(link);
    expect(content.html).toContain(`href="${escapeHtml(link)}"`);
  });
});

describe('message content', () => {
  it('puts the safety caution in the promotion and reinstatement e-mails only', () => {
    const [, promoted] = cases.find(([n]) => n === 'promoted')!;
    const [, reinstated] = cases.find(([n]) => n === 'reinstated')!;
    for (const c of [promoted, reinstated]) {
      expect(c.text).toContain(safetyCaution);
      expect(c.html).toContain(escapeHtml(safetyCaution));
    }
    for (const [name, c] of cases) {
      if (name !== 'promoted' && name !== 'reinstated') expect(c.text).not.toContain(safetyCaution);
    }
  });

  it('tells the invited person the team, the role and who invited them', () => {
    const [, invitation] = cases[0]!;
    expect(invitation.text).toContain(`join the team ${hostile} as reviewer`);
    expect(invitation.text).toContain('2027-03-04');
  });

  it("carries the reviewer's reason to the author and lists each drift finding", () => {
    const [, sentBack] = cases.find(([n]) => n === 'sent back')!;
    expect(sentBack.text).toContain(`Reason: ${hostile}`);
    const [, drift] = cases.find(([n]) => n === 'drift alert')!;
    expect(drift.text).toContain('- n = 256: 1.8× slower');
    expect(drift.html).toContain('<li>n = 256: 1.8× slower</li>');
  });
});

describe('composeEmail', () => {
  it('escapes a link that carries quotes so it cannot leave its attribute', () => {
    const c = composeEmail({
      subject: 's',
      paragraphs: ['p'],
      action: { label: 'Open', url: 'https://x.example/a?b=1&c="onmouseover=' },
    });
    expect(c.html).toContain('href="https://x.example/a?b=1&amp;c=&quot;onmouseover="');
  });
});
