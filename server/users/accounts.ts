import type { DataSource } from 'typeorm';
import type { Role } from '../../shared/auth/roles';
import type { Scoped } from '../db/scoped';
import { conflict } from '../http/errors';
import { publicUser, type PublicUser } from './people';
import { User } from './user.entity';

/** A person with what no ordinary read selects: the password hash and the token version sessions are signed with. */
export type Account = { user: PublicUser; passwordHash: string; tokenVersion: number };

const account = (u: User): Account => ({ user: publicUser(u), passwordHash: u.passwordHash, tokenVersion: u.tokenVersion });

/** The account that signs in with this e-mail, in whichever firm (sign-in asks no firm). */
export async function accountByEmail(db: DataSource, email: string): Promise<Account | null> {
  const user = await db.getRepository(User).createQueryBuilder('u').addSelect('u.passwordHash').where('u.email = :email', { email }).getOne();
  return user ? account(user) : null;
}

/** The signed-in person's own account. */
export async function ownAccount(tx: Scoped, userId: string): Promise<Account> {
  return account(await tx.select(User, 'u').addSelect('u.passwordHash').andWhere('u.id = :id', { id: userId }).getOneOrFail());
}

/** A new password: sessions signed before stop working (the token version moves on). Returns the new version. */
export async function replacePasswordHash(tx: Scoped, userId: string, passwordHash: string): Promise<number> {
  const user = await tx.get(User, { id: userId }, 'That user');
  user.passwordHash = passwordHash;
  user.tokenVersion += 1;
  await tx.save(User, user);
  return user.tokenVersion;
}

/** A new secret for this person's calendar feed; the old address stops working. */
export async function setCalendarToken(tx: Scoped, userId: string, token: string) {
  await tx.updateWhere(User, { id: userId }, { calendarToken: token });
}

/** Whose calendar feed this secret opens (an active person's), or null. */
export async function calendarOwner(db: DataSource, token: string): Promise<{ userId: string; organizationId: string } | null> {
  const [user] = await db.query(`SELECT id, organization_id FROM users WHERE calendar_token = $1 AND NOT disabled`, [token]);
  return user ? { userId: user.id, organizationId: user.organization_id } : null;
}

/** Ends every session of this person, bearer tokens included: the token version moves on. */
export async function endSessions(tx: Scoped, userId: string) {
  await tx.updateWhere(User, { id: userId }, { tokenVersion: () => 'token_version + 1' });
}

/** A person who joined by invitation: they chose their own name and password. E-mail is unique across firms (409 otherwise). */
export async function addPerson(tx: Scoped, person: { email: string; name: string; role: Role; passwordHash: string }): Promise<PublicUser> {
  if (await tx.manager.exists(User, { where: { email: person.email } })) {
    throw conflict('Someone already signs in with that e-mail address.', { fields: { email: 'is already in use' } });
  }
  return publicUser(await tx.insert(User, person));
}

/** Whether anyone in any firm signs in with this e-mail. */
export const emailInUse = (tx: Scoped, email: string) => tx.manager.exists(User, { where: { email } });

/** A person's second step as stored: the sealed TOTP secret (pending or confirmed), its last used step, the recovery code hashes. */
export type SecondStepRecord = { secretSealed: string | null; enabledAt: Date | null; lastStep: number | null; recoveryCodeHashes: string[] };

/** Row-locked (in a transaction) unless `lock` is false, so two code checks cannot spend the same code. */
export async function secondStepOf(tx: Scoped, userId: string, lock = true): Promise<SecondStepRecord> {
  const query = tx.select(User, 'u').addSelect(['u.totpSecret', 'u.totpLastStep', 'u.recoveryCodeHashes']).andWhere('u.id = :id', { id: userId });
  const u = await (lock ? query.setLock('pessimistic_write') : query).getOneOrFail();
  return {
    secretSealed: u.totpSecret,
    enabledAt: u.totpEnabledAt,
    lastStep: u.totpLastStep === null ? null : Number(u.totpLastStep),
    recoveryCodeHashes: u.recoveryCodeHashes,
  };
}

/** Writes what changed of a person's second step; `secretSealed: null` turns it off altogether. */
export async function saveSecondStep(tx: Scoped, userId: string, change: Partial<SecondStepRecord>) {
  const values: Partial<Record<'totpSecret' | 'totpEnabledAt' | 'totpLastStep' | 'recoveryCodeHashes', unknown>> = {};
  if (change.secretSealed !== undefined) values.totpSecret = change.secretSealed;
  if (change.enabledAt !== undefined) values.totpEnabledAt = change.enabledAt;
  if (change.lastStep !== undefined) values.totpLastStep = change.lastStep === null ? null : String(change.lastStep);
  if (change.recoveryCodeHashes !== undefined) values.recoveryCodeHashes = change.recoveryCodeHashes;
  await tx.updateWhere(User, { id: userId }, values as never);
}
