import type { Request } from 'express';
import type { InvitationChoice, SignInProvider } from '@/shared/schemas/session';
import type { InvitationOption } from '../services/sign-in';

declare module 'express-session' {
  interface SessionData {
    /** The signed-in person asked to link another provider's sign-in; the provider's callback links it. */
    identityLink?: { userId: string; provider: SignInProvider; expiresAt: number };
    /** A sign-in proved an address that several organisations invited; the invitee chooses one. */
    invitationChoice?: { provider: SignInProvider; email: string; invitations: InvitationOption[]; expiresAt: number };
    /** The invitation chosen from `invitationChoice`, accepted by the sign-in now under way. */
    chosenInvitationId?: string;
  }
}

/** How long a link request or an invitation choice waits for its sign-in. */
const INTENT_MS = 10 * 60_000;

/** Records the signed-in person's request to link a sign-in with the provider (a CSRF-checked POST). */
export function requestIdentityLink(req: Pick<Request, 'session'>, userId: string, provider: SignInProvider): void {
  req.session.identityLink = { userId, provider, expiresAt: Date.now() + INTENT_MS };
}

/**
 * At a provider's callback: whether this browser asked to link a sign-in, and whether that request still
 * holds (the same person is signed in, the same provider, in time). Undefined when there was no request.
 */
export function identityLinkAt(req: Request, provider: SignInProvider): { valid: boolean } | undefined {
  const link = req.session?.identityLink;
  if (!link) return undefined;
  return { valid: link.provider === provider && link.userId === req.user?.id && link.expiresAt > Date.now() };
}

/** Keeps the invitations the invitee must choose from, after a sign-in proved their address. */
export function offerInvitationChoice(req: Request, provider: SignInProvider, email: string, invitations: InvitationOption[]): void {
  req.session.invitationChoice = { provider, email, invitations, expiresAt: Date.now() + INTENT_MS };
}

/** The invitation choice this browser was offered, with the address to sign in again from; null when none (or expired). */
export function invitationChoiceOf(req: Request): InvitationChoice | null {
  const choice = req.session?.invitationChoice;
  if (!choice || choice.expiresAt <= Date.now()) return null;
  return {
    email: choice.email,
    invitations: choice.invitations.map((option) => ({
      ...option,
      startUrl: `/api/auth/${choice.provider}?invitation=${encodeURIComponent(option.id)}`,
    })),
  };
}

/** At a sign-in's start: remembers the invitation chosen, when it is one this browser was offered. */
export function chooseInvitation(req: Request, invitationId: unknown): void {
  if (typeof invitationId !== 'string') return;
  if (invitationChoiceOf(req)?.invitations.some((option) => option.id === invitationId)) req.session.chosenInvitationId = invitationId;
}

/** The invitation chosen for the sign-in under way, if any. */
export const chosenInvitationOf = (req: Request): string | undefined => req.session?.chosenInvitationId;

/** Forgets link requests and invitation choices once a callback has settled them. */
export function settleIntents(req: Request): void {
  if (!req.session) return;
  delete req.session.identityLink;
  delete req.session.chosenInvitationId;
}

/** Forgets the invitation choice, once a sign-in has chosen. */
export function forgetInvitationChoice(req: Request): void {
  if (req.session) delete req.session.invitationChoice;
}
