import "express-session";

declare module "express-session" {
  interface SessionData {
    csrfToken?: string;
    lastSeenAt?: number;
    /** Set when the session idled out, so the next request can say so. */
    expiredAt?: number;
  }
}
