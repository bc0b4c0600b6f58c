import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import type { AccessToken as AccessTokenDto, CreateTokenBody, TokenScope } from '@/shared/schemas/tokens';
import { notFound } from '../http-error';
import { signedInUser, signedInUserColumns, type SignedInUserRecord } from '../auth/signed-in-user';
import { AccessToken, type User } from '../models';
import { preparedQuery } from '../models/prepared-query';
import { recordAudit } from './audit';

const SECRET_PREFIX = 'tsk_';
const PREFIX_LENGTH = SECRET_PREFIX.length + 6;
/** last_used_at is written at most this often, so a busy script costs no write per request. */
const LAST_USED_RESOLUTION_MS = 60_000;

/** SHA-256 of a token secret, hex: what the database keeps. */
export function hashSecret(secret: string): string {
  return crypto.createHash('sha256').update(secret).digest('hex');
}

function toTokenDto(token: AccessToken): AccessTokenDto {
  return {
    id: token.id,
    name: token.name,
    scope: token.scope,
    prefix: token.prefix,
    createdAt: token.createdAt.toISOString(),
    lastUsedAt: token.lastUsedAt ? token.lastUsedAt.toISOString() : null,
    revokedAt: token.revokedAt ? token.revokedAt.toISOString() : null,
  };
}

/** The person's tokens, newest first, revoked ones included (marked). */
export async function listTokens(user: User): Promise<AccessTokenDto[]> {
  const tokens = await AccessToken.findAll({ where: { userId: user.id }, order: [['createdAt', 'DESC']] });
  return tokens.map(toTokenDto);
}

/** Runs a change of one of the person's tokens and its audit entry in one transaction. */
function auditedTokenChange(
  user: User,
  action: 'token_created' | 'token_revoked',
  change: (transaction: Transaction) => Promise<AccessToken>,
): Promise<AccessToken> {
  const sequelize = AccessToken.sequelize;
  if (!sequelize) throw new Error('access tokens: the models are not initialised on a connection');
  return sequelize.transaction(async (transaction) => {
    const token = await change(transaction);
    await recordAudit(sequelize, transaction, {
      organisationId: user.organisationId,
      craftId: null,
      actorId: user.id,
      action,
      subject: token.name,
      details: { tokenId: token.id, scope: token.scope, prefix: token.prefix },
    });
    return token;
  });
}

/** Creates a token; the secret is returned this once and only its hash is stored. The audit log notes it. */
export async function createToken(user: User, body: CreateTokenBody): Promise<{ token: AccessTokenDto; secret: string }> {
  const secret = `${SECRET_PREFIX}${crypto.randomBytes(32).toString('base64url')}`;
  const token = await auditedTokenChange(user, 'token_created', (transaction) =>
    AccessToken.create(
      { userId: user.id, name: body.name, scope: body.scope, tokenHash: hashSecret(secret), prefix: secret.slice(0, PREFIX_LENGTH) },
      { transaction },
    ),
  );
  return { token: toTokenDto(token), secret };
}

/** Revokes one of the person's tokens (404 for anyone else's); revoking twice is harmless. The audit log notes it. */
export async function revokeToken(user: User, tokenId: string): Promise<void> {
  const token = await AccessToken.findOne({ where: { id: tokenId, userId: user.id } });
  if (!token) throw notFound('Token');
  if (!token.revokedAt)
    await auditedTokenChange(user, 'token_revoked', (transaction) => token.update({ revokedAt: new Date() }, { transaction }));
  forgetToken(token.id);
}

/**
 * Tokens found valid in the last few seconds, by the hash of their secret: a script's requests skip the
 * look-up for that long. A revocation in this process takes effect at once (`forgetToken`); one made through
 * another API process, and changes to the person (removed, admin rights), within RECENT_TOKEN_MS.
 */
const RECENT_TOKEN_MS = 5_000;
const RECENT_TOKENS_MAX = 1_000;
const recentTokens = new Map<string, { owner: TokenOwnerRecord; until: number }>();
/** Counts revocations, so that a look-up that raced one is not kept. */
let revocations = 0;

function forgetToken(tokenId: string): void {
  revocations += 1;
  for (const [hash, { owner }] of recentTokens) if (owner.tokenId === tokenId) recentTokens.delete(hash);
}

/** The valid token of this secret hash with its person, from the recent ones or from the database (noting the use). */
async function tokenOwner(hash: string): Promise<TokenOwnerRecord | null> {
  const recent = recentTokens.get(hash);
  if (recent && recent.until > Date.now()) return recent.owner;
  recentTokens.delete(hash);
  const sequelize = AccessToken.sequelize;
  if (!sequelize) throw new Error('findTokenUser: the models are not initialised on a connection');
  const revocationsBefore = revocations;
  const [found] = await preparedQuery<TokenOwnerRecord>(
    sequelize,
    `SELECT t.id AS "tokenId", t.scope, t.last_used_at AS "lastUsedAt", t.revoked_at AS "revokedAt", ${signedInUserColumns}
     FROM access_tokens t JOIN users u ON u.id = t.user_id JOIN organisations o ON o.id = u.organisation_id
     WHERE t.token_hash = $1`,
    [hash],
  );
  if (!found || found.revokedAt !== null) return null;
  if (found.lastUsedAt === null || Date.now() - found.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await sequelize.query('UPDATE access_tokens SET last_used_at = now() WHERE id = $1', { bind: [found.tokenId] });
  }
  if (revocations === revocationsBefore) {
    if (recentTokens.size >= RECENT_TOKENS_MAX) recentTokens.clear(); // a plain bound: scripts' tokens are few
    recentTokens.set(hash, { owner: found, until: Date.now() + RECENT_TOKEN_MS });
  }
  return found;
}

/**
 * The person and token a bearer secret belongs to, or null when it is unknown or revoked: one query, or none
 * for a token found valid in the last few seconds (see `recentTokens`). Notes the use, at most once a minute.
 * The person is built afresh for each request.
 */
export async function findTokenUser(secret: string): Promise<{ user: User; token: { id: string; scope: TokenScope } } | null> {
  const found = await tokenOwner(hashSecret(secret));
  if (!found) return null;
  return { user: signedInUser(found), token: { id: found.tokenId, scope: found.scope } };
}

interface TokenOwnerRecord extends SignedInUserRecord {
  tokenId: string;
  scope: TokenScope;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}
