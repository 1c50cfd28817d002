import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { EnergyUnit, SessionUserDto, UserPreferences } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { getMeQueryOptions, useMe } from './get-me';

export const updatePreferences = async (changes: UserPreferences) =>
  (await api.patch<{ preferences: UserPreferences }>('/auth/preferences', changes)).preferences;

export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePreferences,
    // Shown at once; the server keeps it for the next session.
    onMutate: (changes) => {
      queryClient.setQueryData(getMeQueryOptions().queryKey, (me: SessionUserDto | null | undefined) =>
        me ? { ...me, preferences: { ...me.preferences, ...changes } } : me,
      );
    },
  });
}

/** The signed-in user's ΔΔG‡ unit (kJ/mol unless they chose kcal/mol) and a setter that remembers it. */
export function useEnergyUnit(): [EnergyUnit, (unit: EnergyUnit) => void] {
  const me = useMe();
  const update = useUpdatePreferences();
  return [me.data?.preferences?.energyUnit ?? 'kJ/mol', (unit) => update.mutate({ energyUnit: unit })];
}
