import { useMutation } from '@tanstack/react-query';
import { login } from '@/api/resources/auth';

export function useLogin() {
  return useMutation({ mutationKey: ['auth', 'login'], mutationFn: login });
}
