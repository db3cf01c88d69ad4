import { z } from 'zod';
import type { Role } from '../auth/principal.js';

export const createMachineTokenSchema = z.strictObject({
  name: z
    .string()
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9 ._-]{0,99}$/, 'use 1 to 100 characters: letters, digits, space, dot, dash or underscore, starting with a letter or digit'),
  ownerUserId: z
    .number()
    .int()
    .positive()
    .max(2_147_483_647)
    .optional()
    .describe('The person the token acts for: specs it pushes are authored by them. An active person whose role may push specs.'),
});

export type CreateMachineTokenInput = z.output<typeof createMachineTokenSchema>;

/** A machine token as the API lists it: never its value nor its hash. */
export interface MachineTokenDto {
  id: number;
  name: string;
  createdBy: { id: number; userName: string } | null;
  /** The person the token acts for (spec pushes are theirs), or null for a token of its own (a watcher, a worker). */
  owner: { id: number; userName: string; role: Role } | null;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** The answer to a creation: the only time the token's value is ever shown. */
export interface CreatedMachineTokenDto {
  token: MachineTokenDto;
  value: string;
}
