import bcrypt from 'bcrypt';
import QRCode from 'qrcode';
import type { DataSource } from 'typeorm';
import { secondStepRoles } from '../../shared/auth/roles';
import type { RecoveryCodesView, SecondStepEnrolmentView, SecondStepState } from '../../shared/auth/views';
import { recordAudit } from '../audit/audit.service';
import type { Scoped } from '../db/scoped';
import { inOrganization, type Actor } from '../db/transaction';
import { conflict, notFound, ruleBroken } from '../http/errors';
import { loadOrgContext } from '../organizations';
import { findPerson, ownAccount, saveSecondStep, secondStepOf, type PublicUser } from '../users';
import type { Sealing } from './sealing';
import { acceptedStep, newRecoveryCodes, newTotpSecret, normalRecoveryCode, totpUri } from './totp';

const wrongCode = () =>
  ruleBroken('wrong_code', 'That code is not right. Type the 6 digits your app shows now.', { fields: { code: 'is not the code your app shows now' } });

/** Two-step sign-in (TOTP, RFC 6238): turning it on and off, and spending a code at sign-in. Secrets are stored sealed. */
export class SecondStep {
  constructor(
    private readonly db: DataSource,
    private readonly sealing: Sealing,
  ) {}

  async state(tx: Scoped, user: PublicUser, firmRequires: boolean): Promise<SecondStepState> {
    const record = await secondStepOf(tx, user.id, false);
    const requiredForRole = firmRequires && secondStepRoles.includes(user.role);
    const on = record.enabledAt !== null;
    return { on, requiredForRole, owed: requiredForRole && !on, recoveryCodesLeft: on ? record.recoveryCodeHashes.length : 0 };
  }

  /** A new secret, pending until a code from it is confirmed; starting again replaces a pending one. */
  start(actor: Actor): Promise<SecondStepEnrolmentView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const record = await secondStepOf(tx, actor.userId);
      if (record.enabledAt) throw conflict('Your second step is already on. Turn it off first to move it to another phone.');
      const me = await findPerson(tx, actor.userId);
      const firm = await loadOrgContext(tx);
      const secret = newTotpSecret();
      await saveSecondStep(tx, actor.userId, { secretSealed: this.sealing.seal(secret), lastStep: null });
      const uri = totpUri(secret, `${firm.name}:${me!.email}`);
      return { secret, uri, qrDataUrl: await QRCode.toDataURL(uri, { margin: 1, width: 240, errorCorrectionLevel: 'M' }) };
    });
  }

  /** The first code proves the app holds the secret; then ten recovery codes, shown once and kept only as keyed hashes. */
  confirm(actor: Actor, code: string): Promise<RecoveryCodesView> {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const record = await secondStepOf(tx, actor.userId);
      if (record.enabledAt) throw conflict('Your second step is already on.');
      if (!record.secretSealed) throw ruleBroken('second_step_not_started', 'Start setting up the second step first: scan the code, then confirm.');
      const step = acceptedStep(this.sealing.unseal(record.secretSealed), code, null);
      if (step === null) throw wrongCode();
      const recoveryCodes = newRecoveryCodes();
      await saveSecondStep(tx, actor.userId, {
        enabledAt: new Date(),
        lastStep: step,
        recoveryCodeHashes: recoveryCodes.map((c) => this.sealing.recoveryCodeHash(normalRecoveryCode(c))),
      });
      await recordAudit(tx, actor, 'user.second_step_on', { type: 'user', id: actor.userId });
      return { recoveryCodes };
    });
  }

  /** The person turns it off with their password; not while the firm requires it of their role. */
  async turnOff(actor: Actor, password: string) {
    await inOrganization(this.db, actor.organizationId, async (tx) => {
      const { user, passwordHash } = await ownAccount(tx, actor.userId);
      if (!(await bcrypt.compare(password, passwordHash))) {
        throw ruleBroken('wrong_password', 'Your password is not right.', { fields: { password: 'is not your current password' } });
      }
      const firm = await loadOrgContext(tx);
      if (firm.secondStepRequired && secondStepRoles.includes(user.role)) {
        throw ruleBroken('second_step_required', 'Your firm requires a second step for your role, so it stays on.');
      }
      await this.clear(tx, actor.userId);
      await recordAudit(tx, actor, 'user.second_step_off', { type: 'user', id: actor.userId });
    });
  }

  /** The owner clears a colleague's second step (a lost phone); audited. */
  clearFor(actor: Actor, userId: string) {
    return inOrganization(this.db, actor.organizationId, async (tx) => {
      const person = await findPerson(tx, userId);
      if (!person) throw notFound('That user');
      if (!person.secondStepOn) throw conflict(`${person.name} has no second step to clear.`);
      await this.clear(tx, userId);
      await recordAudit(tx, actor, 'user.second_step_cleared', { type: 'user', id: userId }, { email: person.email });
      return { ...person, secondStepOn: false };
    });
  }

  /** Spends a code at sign-in: an app code (each time step once) or an unused recovery code. Says which, or null. */
  async spend(tx: Scoped, userId: string, code: string): Promise<'app_code' | 'recovery_code' | null> {
    const record = await secondStepOf(tx, userId);
    if (!record.enabledAt || !record.secretSealed) return null;
    if (/^\d{6}$/.test(code)) {
      const step = acceptedStep(this.sealing.unseal(record.secretSealed), code, record.lastStep);
      if (step === null) return null;
      await saveSecondStep(tx, userId, { lastStep: step });
      return 'app_code';
    }
    const hash = this.sealing.recoveryCodeHash(normalRecoveryCode(code));
    if (!record.recoveryCodeHashes.includes(hash)) return null;
    await saveSecondStep(tx, userId, { recoveryCodeHashes: record.recoveryCodeHashes.filter((h) => h !== hash) });
    return 'recovery_code';
  }

  private clear(tx: Scoped, userId: string) {
    return saveSecondStep(tx, userId, { secretSealed: null, enabledAt: null, lastStep: null, recoveryCodeHashes: [] });
  }
}
