// Teams, members, invitations and e-mail notices: the payloads the API validates and the client's forms
// use, and the names both sides share (roles, notice kinds). No geometry here: the client imports this
// module on its own (`@limbus/schema/team`).

import { z } from 'zod';

import { lineText, noteText, TEXT_LIMITS } from './text.js';

/** Roles a member holds inside one team; site administration is a separate flag on the user. */
export const TEAM_ROLES = ['coordinator', 'observer', 'modeller', 'reviewer'] as const;
export type TeamRole = (typeof TEAM_ROLES)[number];

const roles = z
  .array(z.enum(TEAM_ROLES))
  .min(1, 'choose at least one role')
  .transform((list) => [...new Set(list)].sort());

const email = z
  .string()
  .trim()
  .max(TEXT_LIMITS.email, `at most ${TEXT_LIMITS.email} characters`)
  .pipe(z.email('not an e-mail address'))
  .transform((s) => s.toLowerCase());

/**
 * An invitation names the roles the new member gets. `role` (one role) is the older spelling and is
 * still read; give one of the two.
 */
export const createInvitationPayloadSchema = z
  .strictObject({ email, roles: roles.optional(), role: z.enum(TEAM_ROLES).optional() })
  .superRefine((body, ctx) => {
    if (body.roles === undefined && body.role === undefined)
      ctx.addIssue({ code: 'custom', path: ['roles'], message: 'choose at least one role' });
    if (body.roles !== undefined && body.role !== undefined)
      ctx.addIssue({ code: 'custom', path: ['role'], message: 'give roles or role, not both' });
  })
  .transform(({ email: address, roles: list, role }) => ({
    email: address,
    roles: list ?? (role === undefined ? [] : [role]),
  }));
export type CreateInvitationPayload = z.output<typeof createInvitationPayloadSchema>;

/** Long enough to resist guessing, short enough to hash quickly; common practice, no source. */
export const passwordSchema = z
  .string()
  .min(10, 'must be at least 10 characters')
  .max(200, 'at most 200 characters');

/**
 * A new address gives the new account's name and password; an address that already has an account
 * gives only that account's password (a name sent then is ignored), and the server asks for the name
 * when it is missing for a new account.
 */
export const acceptInvitationPayloadSchema = z.strictObject({
  name: lineText(TEXT_LIMITS.personName, 'name').optional(),
  password: passwordSchema,
});
export type AcceptInvitationPayload = z.output<typeof acceptInvitationPayloadSchema>;

export const updateMemberPayloadSchema = z.strictObject({ roles });
export type UpdateMemberPayload = z.output<typeof updateMemberPayloadSchema>;

/**
 * E-mail notices a member may turn off, one kind each. Invitations and password resets are not
 * notices: they are the only way to reach their page, so they always go out.
 */
export const NOTICE_KINDS = [
  'report-submitted',
  'report-decided',
  'correction-requested',
  'correction-decided',
  'review-requested',
  'review-decided',
  'fit-finished',
  'site-proposed',
  'site-proposal-decided',
] as const;
export type NoticeKind = (typeof NOTICE_KINDS)[number];

export const NOTICE_KIND_LABELS: Record<NoticeKind, string> = {
  'report-submitted': 'An observer submitted a report (to coordinators)',
  'report-decided': 'Your report was accepted or rejected',
  'correction-requested': 'An observer asks to correct an accepted report (to coordinators)',
  'correction-decided': 'Your correction was accepted or rejected',
  'review-requested': 'A fit awaits your review (to reviewers)',
  'review-decided': 'Your fit was approved or returned',
  'fit-finished': 'Your fit finished (solved or failed)',
  'site-proposed': 'An observer proposed a site for an event (to coordinators)',
  'site-proposal-decided': 'Your proposed site was accepted or declined',
};

/**
 * Every kind of e-mail Limbus sends; the `X-Limbus-Kind` header carries it, the outbox filters on it. A
 * briefing is not a notice: a coordinator sends it on purpose to the observers of an event, with the
 * night's times and safety cautions, so it goes out whatever their notice settings (the same content
 * stays on their briefing page).
 */
export const MAIL_KINDS = ['invitation', 'password-reset', 'briefing', ...NOTICE_KINDS] as const;
export type MailKind = (typeof MAIL_KINDS)[number];
export const MAIL_KIND_HEADER = 'X-Limbus-Kind';

export const noticeSettingsPayloadSchema = z.strictObject({
  optOut: z.array(z.enum(NOTICE_KINDS)).transform((list) => [...new Set(list)].sort()),
});
export type NoticeSettingsPayload = z.output<typeof noticeSettingsPayloadSchema>;

/** A message to a member, e.g. with a review request; optional, one paragraph or a few. */
export const messageText = noteText(TEXT_LIMITS.reason);
