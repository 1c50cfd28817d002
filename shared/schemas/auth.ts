import { z } from 'zod';
import { roles } from '../auth/permissions';

/** The shortest password accepted anywhere in the product. */
export const minimumPasswordLength = 10;

const email = z
  .string({ error: 'is required' })
  .trim()
  .min(1, 'is required')
  .max(254, 'must be at most 254 characters')
  .pipe(z.email({ error: 'must be an e-mail address' }))
  .transform((value) => value.toLowerCase());

const newPassword = z
  .string({ error: 'is required' })
  .min(minimumPasswordLength, `must be at least ${minimumPasswordLength} characters`)
  .max(256, 'must be at most 256 characters');

/** The e-mail and new-password rules, for the other account forms (invitations, password reset). */
export const emailInput = email;
export const newPasswordInput = newPassword;

export const signInInput = z.object({
  email,
  password: z.string({ error: 'is required' }).min(1, 'is required').max(256, 'must be at most 256 characters'),
});
export type SignInInput = z.infer<typeof signInInput>;

export const changePasswordInput = z.object({
  currentPassword: z.string({ error: 'is required' }).min(1, 'is required').max(256),
  newPassword,
});
export type ChangePasswordInput = z.infer<typeof changePasswordInput>;

export const roleInput = z.enum(roles, { error: `must be one of ${roles.join(', ')}` });

export const createUserInput = z.object({
  email,
  name: z.string({ error: 'is required' }).trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  role: roleInput,
  password: newPassword,
});
export type CreateUserInput = z.infer<typeof createUserInput>;

export const updateUserInput = z
  .object({
    version: z.number({ error: 'is required' }).int('must be a whole number').min(1),
    role: roleInput.optional(),
    active: z.boolean({ error: 'must be true or false' }).optional(),
    name: z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters').optional(),
  })
  .refine((value) => value.role !== undefined || value.active !== undefined || value.name !== undefined, {
    message: 'give at least one of role, active or name to change',
    path: ['role'],
  });
export type UpdateUserInput = z.infer<typeof updateUserInput>;

export const energyUnits = ['kJ/mol', 'kcal/mol'] as const;
export type EnergyUnit = (typeof energyUnits)[number];

/** Display preferences remembered per user. */
export const userPreferencesInput = z
  .object({
    energyUnit: z.enum(energyUnits, { error: `must be one of ${energyUnits.join(', ')}` }).optional(),
  })
  .strict();
export type UserPreferences = z.infer<typeof userPreferencesInput>;

/** The user as the API returns it. */
export interface UserDto {
  id: number;
  email: string;
  name: string;
  role: (typeof roles)[number];
  active: boolean;
  lastSignInAt: string | null;
  version: number;
}

/** The signed-in user as `/api/auth/me` and sign-in return it. */
export type SessionUserDto = Pick<UserDto, 'id' | 'email' | 'name' | 'role'> & { preferences: UserPreferences };
