import { useMutation } from '@tanstack/react-query';
import { authClient, unwrapAuth } from '../../../lib/auth-client';
import { patterns } from '../../../app/paths';

export async function requestPasswordReset(email: string) {
  return unwrapAuth(await authClient.requestPasswordReset({ email, redirectTo: patterns.resetPassword }));
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
