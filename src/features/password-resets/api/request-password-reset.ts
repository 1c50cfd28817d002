import { useMutation } from '@tanstack/react-query';
import type { RequestPasswordResetInput } from '@shared/schemas/password-reset';
import { api } from '@/lib/api-client';

export const requestPasswordReset = (input: RequestPasswordResetInput) => api.post<{ message: string }>('/password-resets', input);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
