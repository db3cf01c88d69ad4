import { z } from 'zod';
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH } from '../auth/passwords.js';
import { ROLES } from '../auth/principal.js';

export const userNameSchema = z
  .string()
  .trim()
  .toLowerCase()
  .regex(/^[a-z0-9][a-z0-9._-]{1,63}$/, 'use 2 to 64 characters: lower-case letters, digits, dot, dash or underscore, starting with a letter or digit');

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `use at least ${PASSWORD_MIN_LENGTH} characters`)
  .refine((p) => Buffer.byteLength(p, 'utf8') <= PASSWORD_MAX_BYTES, `use at most ${PASSWORD_MAX_BYTES} bytes (bcrypt reads no further)`);

const displayName = z.string().trim().min(1).max(200);
const email = z.string().trim().max(254).pipe(z.email());
const role = z.enum(ROLES);

export const createPersonSchema = z.strictObject({ userName: userNameSchema, displayName, email, role, password: passwordSchema });

export const updatePersonSchema = z
  .strictObject({ displayName: displayName.optional(), email: email.optional(), role: role.optional(), active: z.boolean().optional(), password: passwordSchema.optional() })
  .refine((patch) => Object.values(patch).some((v) => v !== undefined), 'name at least one field to change');

/** A numeric id in the path (INT range); a malformed one is VALIDATION_FAILED, an unknown one NOT_FOUND. */
export const idParamsSchema = z.strictObject({ id: z.coerce.number().int().positive().max(2_147_483_647) });

export type CreatePersonInput = z.output<typeof createPersonSchema>;
export type UpdatePersonInput = z.output<typeof updatePersonSchema>;

/** A person as the API shows them: never the password hash. */
export interface PersonDto {
  id: number;
  userName: string;
  displayName: string;
  email: string;
  role: (typeof ROLES)[number];
  active: boolean;
  createdAt: string;
  updatedAt: string;
}
