/** Asking for a password-reset link and setting the new password with it. */
import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { PasswordResetConfirmBody, PasswordResetRequestBody } from '../db/validation-crew';
import { apiRequest } from './api-client';

/** POST /api/auth/password-reset; resolves with the server's one answer (the same whether or not the address has an account). */
export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (body: PasswordResetRequestBody) => apiRequest('POST', '/api/auth/password-reset', z.object({ message: z.string() }), body),
  });
}

/** POST /api/auth/password-reset/confirm; resolves with the account's e-mail. Errors: RESET_LINK_* (400), RATE_LIMITED (429). */
export function useConfirmPasswordReset() {
  return useMutation({
    mutationFn: (body: PasswordResetConfirmBody) => apiRequest('POST', '/api/auth/password-reset/confirm', z.object({ email: z.string() }), body),
  });
}
