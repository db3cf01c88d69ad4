export const ROLES = ['ops', 'analyst', 'supervisor', 'admin', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** Who is calling: a signed-in person, or a machine token used by the clino CLI. */
export type Principal =
  | { kind: 'person'; userId: number; userName: string; role: Role }
  | { kind: 'machine'; tokenId: number; name: string };

declare module 'express-serve-static-core' {
  interface Request {
    principal?: Principal;
  }
}
