import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { toast } from 'sonner';
import { apiSend } from '@client/api/api-client.ts';

/** Ends the session, forgets every cached answer and goes to the start page. */
export function useSignOut() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: () => apiSend('POST', '/auth/sign-out'),
    onSuccess: async () => {
      queryClient.clear();
      await navigate('/');
      toast.success('Signed out.');
    },
    onError: (error) => toast.error(`Could not sign out: ${error.message}`),
  });
}
