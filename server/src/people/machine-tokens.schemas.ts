import { z } from 'zod';

export const createMachineTokenSchema = z.strictObject({
  name: z
    .string()
    .trim()
    .regex(/^[A-Za-z0-9][A-Za-z0-9 ._-]{0,99}$/, 'use 1 to 100 characters: letters, digits, space, dot, dash or underscore, starting with a letter or digit'),
});

export type CreateMachineTokenInput = z.output<typeof createMachineTokenSchema>;

/** A machine token as the API lists it: never its value nor its hash. */
export interface MachineTokenDto {
  id: number;
  name: string;
  createdBy: { id: number; userName: string } | null;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** The answer to a creation: the only time the token's value is ever shown. */
export interface CreatedMachineTokenDto {
  token: MachineTokenDto;
  value: string;
}
