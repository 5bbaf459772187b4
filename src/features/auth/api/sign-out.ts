import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { toast } from 'sonner';
import { errorMessage } from '@/lib/api-client';

export async function signOut(): Promise<void> {
  const { authClient } = await import('@/lib/auth-client');
  const { error } = await authClient.signOut();
  if (error) throw new Error(error.message ?? 'Sign-out failed.');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: signOut,
    meta: { invalidates: false },
    onSuccess: async () => {
      await navigate('/sign-in', { replace: true });
      queryClient.clear();
    },
    onError: (error) => toast.error(errorMessage(error)),
  });
}
