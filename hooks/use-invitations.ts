/**
 * Invitations: the owner's list with invite, resend and revoke; and, for whoever holds a link, its preview and
 * the accept.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ROLES } from '../db/validation';
import type { InvitationCreateBody } from '../db/validation-crew';
import { apiRequest } from './api-client';
import { membersQueryKey } from './use-members';
import { meQueryKey } from './use-me';

const statusSchema = z.enum(['pending', 'expired', 'accepted', 'revoked']);

const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  status: statusSchema,
  invitedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

const invitationListSchema = z.object({ invitations: z.array(invitationSchema) });
const sentSchema = z.object({ invitation: invitationSchema, mail: z.object({ sent: z.boolean(), message: z.string().optional() }) });
export type InvitationSent = z.infer<typeof sentSchema>;

const previewSchema = z.object({
  invitation: z.object({
    shopName: z.string(),
    role: z.enum(ROLES),
    email: z.string(),
    invitedByName: z.string().nullable(),
    expiresAt: z.string(),
    status: statusSchema,
    hasAccount: z.boolean(),
  }),
});
export type InvitationPreview = z.infer<typeof previewSchema>['invitation'];

const acceptedSchema = z.object({ shopId: z.string(), shopName: z.string(), role: z.enum(ROLES) });

const invitationsKey = (shopId: string) => ['shops', shopId, 'invitations'] as const;

/** GET /api/shops/:shopId/invitations (owners only; pass `enabled` false for other roles). */
export function useInvitations(shopId: string, enabled: boolean) {
  return useQuery({
    queryKey: invitationsKey(shopId),
    queryFn: async () => (await apiRequest('GET', `/api/shops/${shopId}/invitations`, invitationListSchema)).invitations,
    enabled: enabled && shopId !== '',
  });
}

function useRefreshInvitations(shopId: string) {
  const qc = useQueryClient();
  return () => void qc.invalidateQueries({ queryKey: invitationsKey(shopId) });
}

/** POST /api/shops/:shopId/invitations; resolves with the invitation and whether its mail went out. */
export function useCreateInvitation(shopId: string) {
  const refresh = useRefreshInvitations(shopId);
  return useMutation({
    mutationFn: (body: InvitationCreateBody) => apiRequest('POST', `/api/shops/${shopId}/invitations`, sentSchema, body),
    onSettled: refresh,
  });
}

/** POST /api/shops/:shopId/invitations/:id/resend (a new link; the old one stops working). */
export function useResendInvitation(shopId: string) {
  const refresh = useRefreshInvitations(shopId);
  return useMutation({
    mutationFn: (id: string) => apiRequest('POST', `/api/shops/${shopId}/invitations/${id}/resend`, sentSchema),
    onSettled: refresh,
  });
}

/** DELETE /api/shops/:shopId/invitations/:id (the link stops working). */
export function useRevokeInvitation(shopId: string) {
  const refresh = useRefreshInvitations(shopId);
  return useMutation({
    mutationFn: (id: string) => apiRequest('DELETE', `/api/shops/${shopId}/invitations/${id}`, null),
    onSettled: refresh,
  });
}

/** GET /api/invitations/:token (public): shop, role, invited e-mail, status, whether that e-mail has an account. */
export function useInvitationPreview(token: string) {
  return useQuery({
    queryKey: ['invitation', token],
    queryFn: async () => (await apiRequest('GET', `/api/invitations/${token}`, previewSchema)).invitation,
    retry: false,
  });
}

/**
 * POST /api/invitations/:token/accept; on success `me` is refetched (it now lists the shop) and the shop's
 * members list is dropped from the cache. Errors: EMAIL_MISMATCH (403), INVITATION_* (404/410).
 */
export function useAcceptInvitation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest('POST', `/api/invitations/${token}/accept`, acceptedSchema),
    onSuccess: async (accepted) => {
      await qc.invalidateQueries({ queryKey: meQueryKey });
      qc.removeQueries({ queryKey: membersQueryKey(accepted.shopId) });
      qc.removeQueries({ queryKey: ['invitation', token] });
    },
  });
}
