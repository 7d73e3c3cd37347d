/** Shapes of the Isobatch API's JSON bodies, as agreed in the API contract. */

export const ROLES = ["operator", "supervisor", "quality", "engineer", "admin"] as const;

export type Role = (typeof ROLES)[number];

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  mustChangePassword: boolean;
}

export interface SessionState {
  user: SessionUser | null;
  csrfToken: string;
}

export interface Person {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  active: boolean;
  locked: boolean;
  failedSignIns: number;
  mustChangePassword: boolean;
  createdAt: string;
  lastSignInAt: string | null;
}

export interface OutboxMessage {
  id: string;
  to: string;
  subject: string;
  status: "queued" | "sent";
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string | null;
  createdAt: string;
  sentAt: string | null;
}

export interface ReceivedMessage {
  id: string;
  from: string;
  to: string;
  subject: string;
  date: string;
  text: string;
}

export interface AuditEvent {
  seq: number;
  occurredAt: string;
  actorName: string | null;
  action: string;
  entityType: string;
  entityId: string;
  before: unknown;
  after: unknown;
  reason: string | null;
}

export type AuditVerifyResult =
  | { ok: true; checked: number }
  | { ok: false; checked: number; brokenAt: { seq: number; reason: string } };

export interface ApiErrorBody {
  error: { code: string; message: string; field?: string };
}
