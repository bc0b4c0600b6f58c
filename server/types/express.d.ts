/// <reference types="passport" />
import type { User as UserModel } from '../models/user';

declare global {
  namespace Express {
    // The signed-in person, loaded with their organisation by passport's deserializeUser.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserModel {}
  }
}
