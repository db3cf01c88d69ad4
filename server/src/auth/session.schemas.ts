import { z } from 'zod';

export const signInSchema = z.strictObject({
  userName: z.string().trim().min(1).max(64),
  password: z.string().min(1).max(200),
});

export type SignInBody = z.output<typeof signInSchema>;

/** Who is calling, as `GET /api/session` and `POST /api/session` answer it. */
export type SessionPrincipalDto =
  | { kind: 'person'; id: number; userName: string; displayName: string; role: Express.User['role'] }
  | { kind: 'machine'; id: number; name: string; owner: { id: number; userName: string; role: Express.User['role'] } | null };

export interface SessionDto {
  principal: SessionPrincipalDto | null;
}
