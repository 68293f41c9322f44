import { useMutation } from '@tanstack/react-query';
import { authClient, unwrapAuth } from '../../../lib/auth-client';

export async function resetPassword(input: { token: string; newPassword: string }) {
  return unwrapAuth(await authClient.resetPassword({ token: input.token, newPassword: input.newPassword }));
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
