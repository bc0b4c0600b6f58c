/// <reference types="passport" />
import type { TokenScope } from '@/shared/schemas/tokens';
import type { User as UserModel } from '../models/user';

declare global {
  namespace Express {
    // The signed-in person, loaded with their organisation by passport's deserializeUser or the bearer token.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserModel {}

    interface Request {
      /** Set when the request signed in with a personal access token instead of a session. */
      accessToken?: { id: string; scope: TokenScope };
    }
  }
}
