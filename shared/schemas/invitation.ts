import { z } from 'zod';
import type { Role } from '../auth/permissions';
import { emailInput, newPasswordInput, roleInput } from './auth';
import type { PersonRefDto } from './campaign';
import { linkTokenInput } from './link-token';

/** How long an invitation link works. */
export const invitationLifetimeHours = 72;

/** Body of POST /api/invitations. */
export const createInvitationInput = z.object({ email: emailInput, role: roleInput });
export type CreateInvitationInput = z.infer<typeof createInvitationInput>;

/** Body of POST /api/invitations/:id/revoke. */
export const revokeInvitationInput = z.object({
  version: z.number({ error: 'is required' }).int('must be a whole number').min(1, 'must be at least 1'),
});
export type RevokeInvitationInput = z.infer<typeof revokeInvitationInput>;

/** Body of POST /api/invitations/accept: the invitee's name and password. */
export const acceptInvitationInput = z.object({
  token: linkTokenInput,
  name: z.string({ error: 'is required' }).trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  password: newPasswordInput,
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInput>;

export const invitationStatuses = ['pending', 'accepted', 'expired', 'revoked'] as const;
export type InvitationStatus = (typeof invitationStatuses)[number];

/** An invitation as the admin sees it. */
export interface InvitationDto {
  id: number;
  email: string;
  role: Role;
  status: InvitationStatus;
  invitedBy: PersonRefDto | null;
  expiresAt: string;
  acceptedAt: string | null;
  createdAt: string;
  version: number;
}

/** GET /api/invitations/lookup: what the invitee sees before accepting. */
export interface InvitationLookupDto {
  email: string;
  role: Role;
  invitedBy: string | null;
  expiresAt: string;
}
