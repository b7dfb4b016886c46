/**
 * A shop's members: the list, role and print-set changes, removal. Each change refreshes the list and `me`
 * (the changed person may be the one signed in).
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ROLES } from '../db/validation';
import type { MemberUpdateBody } from '../db/validation-crew';
import { apiRequest } from './api-client';
import { meQueryKey } from './use-me';

const memberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  canSeePrintSets: z.boolean(),
  joinedAt: z.string(),
  email: z.string().optional(),
});
export type Member = z.infer<typeof memberSchema>;

const memberListSchema = z.object({ members: z.array(memberSchema) });
const memberEnvelopeSchema = z.object({ member: memberSchema });

/** Cache key of a shop's members list. */
export const membersQueryKey = (shopId: string) => ['shops', shopId, 'members'] as const;

/** GET /api/shops/:shopId/members (owners first; e-mails only when the caller is an owner). */
export function useMembers(shopId: string) {
  return useQuery({
    queryKey: membersQueryKey(shopId),
    queryFn: async () => (await apiRequest('GET', `/api/shops/${shopId}/members`, memberListSchema)).members,
    enabled: shopId !== '',
  });
}

function useRefreshMembers(shopId: string) {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: membersQueryKey(shopId) });
    void qc.invalidateQueries({ queryKey: meQueryKey });
  };
}

/** PATCH /api/shops/:shopId/members/:userId with a new role and/or print-set grant. Errors: LAST_OWNER (409). */
export function useUpdateMember(shopId: string) {
  const refresh = useRefreshMembers(shopId);
  return useMutation({
    mutationFn: ({ userId, change }: { userId: string; change: MemberUpdateBody }) =>
      apiRequest('PATCH', `/api/shops/${shopId}/members/${userId}`, memberEnvelopeSchema, change),
    onSettled: refresh,
  });
}

/** DELETE /api/shops/:shopId/members/:userId. Errors: LAST_OWNER (409). */
export function useRemoveMember(shopId: string) {
  const refresh = useRefreshMembers(shopId);
  return useMutation({
    mutationFn: (userId: string) => apiRequest('DELETE', `/api/shops/${shopId}/members/${userId}`, null),
    onSettled: refresh,
  });
}
