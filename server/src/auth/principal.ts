export const ROLES = ['ops', 'analyst', 'supervisor', 'admin', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** The person a machine token belongs to, when an admin gave it an owner. */
export interface TokenOwner {
  userId: number;
  userName: string;
  role: Role;
}

/**
 * Who is calling: a signed-in person, or a machine token used by the clino CLI. A machine keeps the
 * `machine` grants of the role matrix whether or not it has an owner; the owner only decides who
 * authors what the token pushes (a spec revision), so four eyes can apply to it.
 */
export type Principal =
  | { kind: 'person'; userId: number; userName: string; role: Role }
  | { kind: 'machine'; tokenId: number; name: string; owner?: TokenOwner };

declare module 'express-serve-static-core' {
  interface Request {
    principal?: Principal;
  }
}
