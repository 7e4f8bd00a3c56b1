import type { Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import type { Role } from '../services/roles.js';
import type { HashedFile } from './hashing-storage.js';

/**
 * Who may call a route: anyone; anyone signed in; a member with at least this role in the path's
 * `:organisationId`; or an admin of any organisation.
 */
export type Access = 'public' | 'signed-in' | 'any-admin' | Role;

/** How the caller proved who they are. */
export type AuthMethod = 'session' | 'token';

/** The caller of a route after authentication and authorisation. */
export interface AuthContext {
  /** `null` only on public routes called anonymously. */
  userId: string | null;
  via: AuthMethod | null;
  /** The token used, when `via` is `token`. */
  tokenId: string | null;
  /** The path's organisation on member routes. */
  organisationId: string | null;
  /** The caller's effective role there (a token's is capped by its scope). */
  role: Role | null;
}

/** One documented response. */
export interface ResponseSpec {
  description: string;
  schema?: z.ZodType;
  /** Defaults to application/json. */
  contentType?: string;
}

/** What a handler receives: validated input and the caller. */
export interface RouteInput<P extends z.ZodType, Q extends z.ZodType, B extends z.ZodType> {
  params: z.output<P>;
  query: z.output<Q>;
  body: z.output<B>;
  auth: AuthContext;
  /** Files of a multipart upload route, in the order sent, each with the SHA-256 taken while it streamed in. */
  files: HashedFile[];
}

/** One route of the API: everything the router, the OpenAPI document and the authorisation matrix need. */
export interface RouteSpec<
  P extends z.ZodType = z.ZodType,
  Q extends z.ZodType = z.ZodType,
  B extends z.ZodType = z.ZodType,
> {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** Express path under `/api/v1`, e.g. `/organisations/:organisationId/members`. */
  path: string;
  summary: string;
  tag: string;
  access: Access;
  /** Refused to API tokens (e.g. creating tokens, signing out). */
  sessionOnly?: boolean;
  params?: P;
  query?: Q;
  body?: B;
  /** Multipart upload: the field holding the files and how many may come at once. */
  upload?: { field: string; maxFiles: number };
  /** Extra middleware run before authentication (rate limits). */
  before?: RequestHandler[];
  responses: Record<number, ResponseSpec>;
  handler: (input: RouteInput<P, Q, B>, req: Request, res: Response) => Promise<void> | void;
}

/** Keeps the zod types of one route together; the table itself holds `RouteSpec` of any shape. */
export function defineRoute<
  P extends z.ZodType = z.ZodType,
  Q extends z.ZodType = z.ZodType,
  B extends z.ZodType = z.ZodType,
>(spec: RouteSpec<P, Q, B>): RouteSpec {
  return spec as unknown as RouteSpec;
}

/** Whether the method changes state (and so needs a write scope and a CSRF check). */
export function isStateChanging(method: string): boolean {
  return !['get', 'head', 'options'].includes(method.toLowerCase());
}
