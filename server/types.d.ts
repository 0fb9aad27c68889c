import type { User as UserEntity } from './db/entities/user.entity';
import type { Membership } from './db/entities/membership.entity';

declare global {
  namespace Express {
    // passport's req.user is our User entity
    interface User extends UserEntity {}
    interface Request {
      /** set by requireRole on /api/productions/:productionId routes */
      membership?: Membership;
    }
  }
}
declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}
export {};
